package org.kwanta.service.deploy;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Assumptions;

/** Runs Alertmanager's amtool (Debian package {@code prometheus-alertmanager}) when installed. */
final class Amtool {

  private Amtool() {}

  static Optional<Path> find() {
    String path = System.getenv().getOrDefault("PATH", "");
    List<Path> candidates = new ArrayList<>();
    for (String dir : path.split(java.io.File.pathSeparator)) {
      if (!dir.isBlank()) {
        candidates.add(Path.of(dir, "amtool"));
      }
    }
    candidates.add(Path.of("/usr/bin/amtool"));
    return candidates.stream().filter(Files::isExecutable).findFirst();
  }

  /** Runs amtool with the arguments in {@code dir}; skips visibly when amtool is absent. */
  static String run(Path dir, String... args) throws IOException, InterruptedException {
    Optional<Path> amtool = find();
    Assumptions.assumeTrue(
        amtool.isPresent(),
        "amtool not found on PATH or in /usr/bin: install the Debian package"
            + " 'prometheus-alertmanager' to check the Alertmanager configuration");
    List<String> command = new ArrayList<>();
    command.add(amtool.orElseThrow().toString());
    command.addAll(List.of(args));
    Process process =
        new ProcessBuilder(command).directory(dir.toFile()).redirectErrorStream(true).start();
    boolean finished = process.waitFor(60, TimeUnit.SECONDS);
    if (!finished) {
      process.destroyForcibly();
    }
    String output = new String(process.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    assertThat(finished).as("amtool finished: " + command).isTrue();
    assertThat(process.exitValue()).as(String.join(" ", command) + "\n" + output).isZero();
    return output;
  }
}

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

/** Runs Prometheus's promtool (Debian package {@code prometheus}) when it is installed. */
final class Promtool {

  private Promtool() {}

  static Optional<Path> find() {
    String path = System.getenv().getOrDefault("PATH", "");
    List<Path> candidates = new ArrayList<>();
    for (String dir : path.split(java.io.File.pathSeparator)) {
      if (!dir.isBlank()) {
        candidates.add(Path.of(dir, "promtool"));
      }
    }
    candidates.add(Path.of("/usr/bin/promtool"));
    return candidates.stream().filter(Files::isExecutable).findFirst();
  }

  /** Skips the calling test, with the reason shown in the report, when promtool is absent. */
  static Path require() {
    Optional<Path> promtool = find();
    Assumptions.assumeTrue(
        promtool.isPresent(),
        "promtool not found on PATH or in /usr/bin: install the Debian package 'prometheus' to"
            + " check the alert rules and dashboard queries");
    return promtool.orElseThrow();
  }

  /** Runs promtool with the arguments in {@code dir}; asserts exit status 0 and returns output. */
  static String run(Path dir, String... args) throws IOException, InterruptedException {
    List<String> command = new ArrayList<>();
    command.add(require().toString());
    command.addAll(List.of(args));
    Process process =
        new ProcessBuilder(command).directory(dir.toFile()).redirectErrorStream(true).start();
    boolean finished = process.waitFor(120, TimeUnit.SECONDS);
    if (!finished) {
      process.destroyForcibly();
    }
    String output = new String(process.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    assertThat(finished).as("promtool finished: " + command).isTrue();
    assertThat(process.exitValue()).as(String.join(" ", command) + "\n" + output).isZero();
    return output;
  }
}

package org.kwanta.service;

import static com.tngtech.archunit.library.dependencies.SlicesRuleDefinition.slices;
import static org.assertj.core.api.Assertions.assertThat;

import com.tngtech.archunit.core.domain.JavaClasses;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * The service's package structure: one package per feature, no cycles between them, and the ingest
 * package the only owner of the tables it writes (everyone else reads them through its read APIs,
 * {@code ReadingHistory} and {@code Evaluations}).
 */
class PackageStructureTest {

  /** Imported once for both architecture tests (the import is most of their time). */
  private static final JavaClasses SERVICE = ArchitectureTest.SERVICE;

  @Test
  void featurePackagesAreFreeOfCycles() {
    slices().matching("org.kwanta.service.(*)..").should().beFreeOfCycles().check(SERVICE);
  }

  /** SQL naming a table of the ingest: FROM, JOIN, INTO or UPDATE followed by its name. */
  private static final Pattern INGEST_TABLE =
      Pattern.compile(
          "\\b(?i:from|join|into|update)\\s+(reading|reading_head|reading_revision|evaluation|evaluation_shape"
              + "|lab_result|reading_rollup_hour|reading_rollup_day|reading_point|reading_parameter"
              + "|reading_named)\\b");

  @Test
  void onlyTheIngestTouchesItsTables() throws IOException {
    Path root = Path.of("src/main/java/org/kwanta/service");
    Path ingest = root.resolve("ingest");
    List<String> offenders;
    try (Stream<Path> files = Files.walk(root)) {
      offenders =
          files
              .filter(p -> p.toString().endsWith(".java") && !p.startsWith(ingest))
              .filter(p -> INGEST_TABLE.matcher(read(p)).find())
              .map(p -> root.relativize(p).toString())
              .sorted()
              .toList();
    }
    assertThat(offenders).as("classes reading the ingest's tables directly").isEmpty();
  }

  private static String read(Path p) {
    try {
      return Files.readString(p);
    } catch (IOException e) {
      throw new java.io.UncheckedIOException(e);
    }
  }
}

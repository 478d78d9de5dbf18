package org.kwanta.model.evaluation;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The reason codes, their meanings and what they point at are documented in one table of the
 * project's notes ({@code docs/conductivity-and-checks.md}, section "Reason codes"): that table
 * lists every {@link ReasonCode} exactly once, with a meaning and what it points at, and no other
 * code.
 */
class ReasonCodeTableTest {

  private static final Path NOTES =
      Path.of(System.getProperty("basedir", "."))
          .resolve("../docs/conductivity-and-checks.md")
          .normalize();

  private static final String HEADER = "| code | meaning | points at |";

  @Test
  void everyReasonCodeIsInTheOneTableOfTheNotes() throws IOException {
    List<String> lines = Files.readAllLines(NOTES);
    assertThat(lines.stream().filter(HEADER::equals)).as("tables of reason codes").hasSize(1);
    List<String> documented = new ArrayList<>();
    int start = lines.indexOf(HEADER) + 2; // after the header and its separator row
    for (int i = start; i < lines.size() && lines.get(i).startsWith("|"); i++) {
      String[] cells = lines.get(i).split("\\|");
      // cells: "", code, meaning, points at
      assertThat(cells).as(lines.get(i)).hasSize(4);
      assertThat(cells[2].strip()).as("meaning of %s", cells[1]).isNotEmpty();
      assertThat(cells[3].strip()).as("what %s points at", cells[1]).isNotEmpty();
      documented.add(cells[1].strip().replace("`", ""));
    }
    assertThat(documented)
        .containsExactlyInAnyOrderElementsOf(
            Arrays.stream(ReasonCode.values()).map(Enum::name).toList());
  }
}

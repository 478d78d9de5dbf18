package org.kwanta.model.evaluation;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Locale;
import org.junit.jupiter.api.Test;

/**
 * The findings' text written directly ({@link Checks#format}) equals what the JDK's {@code
 * java.util.Formatter} writes for the same template and arguments (the reference: the JDK).
 */
class ChecksFormatTest {

  private static void same(String fmt, Object... args) {
    assertThat(Checks.format(fmt, args)).isEqualTo(String.format(Locale.ROOT, fmt, args));
  }

  @Test
  void theFindingsTemplatesAsTheFormatterWritesThem() {
    same("%s: latest reading is %d min old (maximum %d min).", "pH", 12L, 10);
    same(
        "Measured pH %s differs from calculated %s by %s (band ±%s) for %d min.",
        "9.60", "9.29", "0.313", "0.200", -3L);
    same("%s reads below theoretical pure water: cell constant.", "SC");
    same("%s: unchanged at %s %s for at least %d min.", null, "0.0500", "µS/cm", 240);
    same("100%% of %s", "x");
    same("%5.2f and %s", 1.5, "y");
    same("no placeholders");
    same("%s and %s", "only one", "two");
  }
}

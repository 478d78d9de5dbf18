package org.kwanta.model.evaluation;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;

/**
 * A number to three significant digits as {@code String.format(Locale.ROOT, "%.3g", v)} writes it
 * (the findings' explanations), without the formatter: parsing the format string and looking up the
 * locale's symbols for every number took about a tenth of the ingest's Java time when every
 * evaluation carried a finding. {@code ThreeDigitsTest} compares the two on random and edge values.
 *
 * <p>As the JDK's {@code %g}: the shortest decimal that reads back as the double ({@link
 * BigDecimal#valueOf(double)}) rounded half up to three significant digits; plain notation when the
 * rounded magnitude is at least 10⁻⁴ and below 10³, otherwise {@code d.dde±XX}.
 */
final class ThreeDigits {

  private static final MathContext THREE = new MathContext(3, RoundingMode.HALF_UP);
  private static final BigDecimal SMALL = new BigDecimal("0.0001");
  private static final BigDecimal LARGE = new BigDecimal("1000");

  private ThreeDigits() {}

  static String of(double v) {
    if (Double.isNaN(v)) {
      return "NaN";
    }
    if (Double.isInfinite(v)) {
      return v > 0 ? "Infinity" : "-Infinity";
    }
    if (v == 0) {
      return Double.doubleToRawLongBits(v) < 0 ? "-0.00" : "0.00";
    }
    BigDecimal r = BigDecimal.valueOf(v).round(THREE);
    BigDecimal abs = r.abs();
    // the exponent of the leading digit
    int exponent = r.precision() - r.scale() - 1;
    if (abs.compareTo(SMALL) >= 0 && abs.compareTo(LARGE) < 0) {
      return r.setScale(Math.max(0, 2 - exponent), RoundingMode.HALF_UP).toPlainString();
    }
    BigDecimal mantissa = r.movePointLeft(exponent).setScale(2, RoundingMode.HALF_UP);
    StringBuilder s = new StringBuilder(12).append(mantissa.toPlainString()).append('e');
    s.append(exponent < 0 ? '-' : '+');
    int e = Math.abs(exponent);
    if (e < 10) {
      s.append('0');
    }
    return s.append(e).toString();
  }
}

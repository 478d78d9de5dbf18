package org.kwanta.model.aqueous;

/**
 * Conventional chemical typography for formulas and reactions: digits of a formula as subscripts,
 * the charge as a superscript with the number before the sign ("SO₄²⁻", "H⁺").
 */
final class Typography {

  private static final String SUBSCRIPTS = "₀₁₂₃₄₅₆₇₈₉";
  private static final String SUPERSCRIPTS = "⁰¹²³⁴⁵⁶⁷⁸⁹";

  private Typography() {}

  /**
   * A formula with its charge.
   *
   * @param formula ASCII formula without charge, e.g. {@code "SO4"}
   * @param chargeNumber the charge number z
   */
  static String symbol(String formula, int chargeNumber) {
    StringBuilder b = new StringBuilder(formula.length() + 2);
    for (int i = 0; i < formula.length(); i++) {
      char c = formula.charAt(i);
      b.append(c >= '0' && c <= '9' ? SUBSCRIPTS.charAt(c - '0') : c);
    }
    int n = Math.abs(chargeNumber);
    if (n > 1) {
      b.append(SUPERSCRIPTS.charAt(n));
    }
    if (chargeNumber > 0) {
      b.append('⁺');
    } else if (chargeNumber < 0) {
      b.append('⁻');
    }
    return b.toString();
  }
}

package org.kwanta.model.evaluation;

/**
 * pH at 25 °C calculated from the conductivities.
 *
 * @param rigorous pH from the inferred composition by charge balance (NaN without SC)
 * @param rigorousUncertainty its spread from the instrument tolerances
 * @param tradeFormula log10(SC − CACE/3) + K with K per alkalizer (NaN when not computable)
 * @param tradeFormulaConstant the K used
 * @param tradeFormulaInWindow true when the formula's conditions hold
 * @param tradeFormulaNote why the formula is outside its window (empty when inside)
 */
public record CalculatedPh(
    double rigorous,
    double rigorousUncertainty,
    double tradeFormula,
    double tradeFormulaConstant,
    boolean tradeFormulaInWindow,
    String tradeFormulaNote) {}

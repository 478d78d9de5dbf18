package org.kwanta.model.evaluation;

import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.kwanta.model.Parameter;

/**
 * The evaluation of one sample-point snapshot.
 *
 * @param samplePointId the point
 * @param compensated conductivities at 25 °C, per channel used
 * @param composition the inferred composition (empty without conductivities to infer from)
 * @param calculatedPh calculated pH at 25 °C (empty without specific conductivity)
 * @param operatingPh pH at operating temperature and pressure (empty without a composition
 *     including specific conductivity)
 * @param findings the checks that fired, in a fixed order; empty when all agree
 * @param notes why a part was not evaluated (for example the pH at temperature of a steam sample
 *     beyond the engine's range); the other parts stand
 */
public record Evaluation(
    String samplePointId,
    Map<Parameter, CompensatedValue> compensated,
    Optional<InferredComposition> composition,
    Optional<CalculatedPh> calculatedPh,
    Optional<OperatingPh> operatingPh,
    List<Finding> findings,
    List<String> notes) {

  public Evaluation {
    compensated = Map.copyOf(compensated);
    findings = List.copyOf(findings);
    notes = List.copyOf(notes);
  }
}

package org.kwanta.service.diagnosis;

import java.util.List;
import java.util.Locale;
import org.kwanta.model.evaluation.Finding;

/**
 * A finding on the wire: code, what it points at (an instrument, the sample conditioning or the
 * process), the explanation, and the evidence: expected, read, residual (read − expected) and the
 * tolerance, in the stated unit.
 */
public record FindingOut(String code, String pointsAt, String explanation, EvidenceOut evidence) {

  /** The numbers behind a finding. */
  public record EvidenceOut(
      String quantity,
      String unit,
      double expected,
      double read,
      double residual,
      double tolerance) {}

  public static FindingOut of(Finding f) {
    Finding.Evidence e = f.evidence();
    return new FindingOut(
        f.code().name(),
        f.pointsAt().name().toLowerCase(Locale.ROOT),
        f.explanation(),
        e == null
            ? null
            : new EvidenceOut(
                e.quantity(), e.unit(), e.expected(), e.read(), e.residual(), e.tolerance()));
  }

  public static List<FindingOut> of(List<Finding> findings) {
    return findings.stream().map(FindingOut::of).toList();
  }
}

package org.kwanta.service.diagnosis;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.Parameter;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.format.DateTimeParseException;
import java.util.List;
import org.kwanta.service.ingest.IngestRequest;
import org.kwanta.service.system.ProblemException;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

@RestController
@Tag(
    name = "Diagnosis",
    description =
        "Each channel against its own day-long baseline and against what the other channels and"
            + " the neighbouring points on the cycle predict. Advisory: the plant's own chemistry"
            + " guidelines, local codes and qualified practice govern.")
class DiagnosisController {

  private final DiagnosisService diagnosis;
  private final Clock clock;

  DiagnosisController(DiagnosisService diagnosis, Clock clock) {
    this.diagnosis = diagnosis;
    this.clock = clock;
  }

  /** The diagnosis of one minute. */
  record MinuteFindings(Instant time, List<FindingOut> findings) {}

  /** Findings over a time range. */
  record FindingsOverTime(
      String samplePoint, Instant from, Instant to, String method, List<MinuteFindings> minutes) {}

  static final String METHOD =
      "Per channel: median of the last 3 min against the median of 24 h ending 1 h before the"
          + " quarter hour, significant beyond max(4 x 1.4826 MAD, tolerance floor); pH residual"
          + " drift by a two-sided CUSUM (k 0.05 pH, h 1.5 pH min, 8 h); cooling-water proportions"
          + " per the plant declaration (sea water: Millero et al. 2008). Rules:"
          + " docs/diagnosis.md.";

  @GetMapping("/api/v1/sample-points/{samplePoint}/findings")
  @Operation(
      summary = "The diagnosis of a sample point over time",
      description =
          "Minute by minute over [from, to] (at most 7 days; default the last 24 h), the findings"
              + " of the diagnosis over time, each with what was expected, what was read, the"
              + " residual and its tolerance. Only minutes with findings are listed unless"
              + " all=true. Computed from the stored evaluations and readings, so the same stored"
              + " data always gives the same answer. Advisory.")
  FindingsOverTime findings(
      @Parameter(example = "U2-CPD") @PathVariable("samplePoint") String samplePointId,
      @RequestParam(required = false) String from,
      @RequestParam(required = false) String to,
      @RequestParam(defaultValue = "false") boolean all) {
    Instant end = to == null ? clock.instant() : instant("to", to);
    Instant start = from == null ? end.minus(Duration.ofHours(24)) : instant("from", from);
    List<MinuteFindings> minutes =
        diagnosis.overTime(samplePointId, start, end).stream()
            .filter(d -> all || !d.findings().isEmpty())
            .map(d -> new MinuteFindings(d.time(), FindingOut.of(d.findings())))
            .toList();
    return new FindingsOverTime(samplePointId, start, end, METHOD, minutes);
  }

  /** A what-if minute. */
  record WhatIfMinuteOut(
      Instant time,
      Double specificConductivity25,
      Double cationConductivity25,
      Double degassedCationConductivity25,
      Double phMeasured,
      Double phCalculated25,
      Double sodiumUgPerKg,
      List<org.kwanta.service.ingest.EvaluationView.FindingView> instantChecks,
      List<FindingOut> diagnosis) {}

  /** The answer of a what-if run. */
  record WhatIf(String samplePoint, String method, String caution, List<WhatIfMinuteOut> minutes) {}

  @PostMapping("/api/v1/sample-points/{samplePoint}/diagnosis")
  @Operation(
      summary = "Diagnose posted readings (what-if; stores nothing)",
      description =
          "Post a window of readings of this sample point, and optionally of its neighbours on the"
              + " cycle, in the body format of POST /api/v1/readings (JSON). Each is validated and"
              + " converted as the ingest would, evaluated with the point's stored configuration,"
              + " and diagnosed minute by minute; nothing is stored. Baselines need about 2 h of"
              + " readings before a change, full ones 25 h. Advisory.")
  WhatIf whatIf(
      @Parameter(example = "U2-CPD") @PathVariable("samplePoint") String samplePointId,
      @RequestBody IngestRequest body) {
    if (body == null || body.readings() == null) {
      throw ProblemException.of("body must be {\"readings\": [...]}");
    }
    List<WhatIfMinuteOut> minutes =
        diagnosis.whatIf(samplePointId, body.readings()).stream()
            .map(
                m ->
                    new WhatIfMinuteOut(
                        m.time(),
                        m.specificConductivity25(),
                        m.cationConductivity25(),
                        m.degassedCationConductivity25(),
                        m.phMeasured(),
                        m.phCalculated25(),
                        m.sodium(),
                        m.instantChecks(),
                        FindingOut.of(m.diagnosis())))
            .toList();
    return new WhatIf(
        samplePointId,
        METHOD,
        "Advisory: calculations from the readings given; the plant's own chemistry guidelines,"
            + " local codes and qualified practice govern.",
        minutes);
  }

  private static Instant instant(String name, String value) {
    try {
      return OffsetDateTime.parse(value).toInstant();
    } catch (DateTimeParseException e) {
      throw ProblemException.of(name + " must be an ISO 8601 time with an offset: " + value);
    }
  }
}

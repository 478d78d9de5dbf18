package org.kwanta.service.diagnosis;

import io.micrometer.core.instrument.MeterRegistry;
import io.micrometer.core.instrument.MultiGauge;
import io.micrometer.core.instrument.Tags;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.kwanta.model.evaluation.Finding;
import org.kwanta.service.system.MetricNames;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.scheduling.annotation.Scheduled;
import org.springframework.stereotype.Component;

/**
 * Exposes the current diagnosis as {@code kwanta_diagnosis_finding}: one series of value 1 per
 * active finding, labelled with the point, the reason code and what it points at.
 */
@Component
class DiagnosisMetrics {

  private static final Logger log = LoggerFactory.getLogger(DiagnosisMetrics.class);

  private final DiagnosisService diagnosis;
  private final JdbcClient jdbc;
  private final MultiGauge findings;

  DiagnosisMetrics(DiagnosisService diagnosis, JdbcClient jdbc, MeterRegistry registry) {
    this.diagnosis = diagnosis;
    this.jdbc = jdbc;
    MetricNames.Metric m =
        MetricNames.METRICS.stream()
            .filter(x -> x.micrometerName().equals(MetricNames.DIAGNOSIS_FINDING))
            .findFirst()
            .orElseThrow();
    this.findings = MultiGauge.builder(m.micrometerName()).description(m.help()).register(registry);
  }

  private record PointRow(String plant, String block, String id) {}

  @Scheduled(
      fixedDelayString = "${kwanta.metrics.refresh:PT30S}",
      initialDelayString = "${kwanta.metrics.initial-delay:PT5S}")
  void refresh() {
    try {
      List<PointRow> points =
          jdbc.sql("SELECT plant_id, block_id, id FROM sample_point ORDER BY plant_id, id")
              .query((rs, i) -> new PointRow(rs.getString(1), rs.getString(2), rs.getString(3)))
              .list();
      List<MultiGauge.Row<?>> rows = new ArrayList<>();
      Map<String, Map<String, DiagnosisService.PointDiagnosis>> byPlant = new java.util.HashMap<>();
      for (PointRow p : points) {
        DiagnosisService.PointDiagnosis d =
            byPlant.computeIfAbsent(p.plant(), diagnosis::current).get(p.id());
        if (d == null) {
          continue;
        }
        for (Finding f : d.findings()) {
          rows.add(
              MultiGauge.Row.of(
                  Tags.of(
                      MetricNames.PLANT, p.plant(),
                      MetricNames.BLOCK, p.block(),
                      MetricNames.SAMPLE_POINT, p.id(),
                      MetricNames.REASON_CODE, f.code().name(),
                      MetricNames.POINTS_AT, f.pointsAt().name().toLowerCase(Locale.ROOT)),
                  1));
        }
      }
      findings.register(rows, true);
    } catch (RuntimeException e) {
      log.warn("Diagnosis metrics not refreshed: {}", e.getMessage());
    }
  }
}

package org.kwanta.service.limits;

import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;
import org.kwanta.model.Parameter;
import org.kwanta.service.audit.Actor;
import org.kwanta.service.audit.AuditLog;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/** Appends acknowledgements of excursions, each with its row in the audit log. */
@Service
class Acknowledgements {

  private final ExcursionFinder finder;
  private final AuditLog audit;

  Acknowledgements(ExcursionFinder finder, AuditLog audit) {
    this.finder = finder;
    this.audit = audit;
  }

  /** The acknowledgement appended, empty when no such excursion exists (as reported). */
  @Transactional
  Optional<ExcursionFinder.Acknowledgement> acknowledge(
      Limits.Point point, Parameter parameter, Instant start, Actor by, String note) {
    Optional<ExcursionFinder.Acknowledgement> ack =
        finder.acknowledge(point, parameter, start, by.keyId(), by.keyName(), note);
    ack.ifPresent(
        a -> {
          Map<String, Object> after = new LinkedHashMap<>();
          after.put("samplePoint", point.id());
          after.put("parameter", parameter.code());
          after.put("excursionStart", start.toString());
          after.put("acknowledgedAt", a.at().toString());
          after.put("note", a.note());
          audit.record(
              "acknowledgement.create",
              "acknowledgement",
              point.id() + "/" + parameter.code() + "/" + start,
              null,
              after);
        });
    return ack;
  }
}

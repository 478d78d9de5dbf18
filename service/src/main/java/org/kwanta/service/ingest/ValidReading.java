package org.kwanta.service.ingest;

import java.time.Instant;
import org.kwanta.model.Parameter;

/**
 * A checked reading in the canonical unit of its parameter.
 *
 * @param sampleTemperatureCel NaN when not given
 */
public record ValidReading(
    String samplePointId,
    Parameter parameter,
    Instant time,
    double value,
    Quality quality,
    double sampleTemperatureCel,
    boolean compensated) {

  /** Reading quality as the historian reports it. */
  public enum Quality {
    GOOD,
    UNCERTAIN,
    BAD;

    public short code() {
      return (short) ordinal();
    }

    public static Quality ofCode(int code) {
      return values()[code];
    }
  }
}

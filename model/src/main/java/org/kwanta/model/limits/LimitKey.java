package org.kwanta.model.limits;

import java.util.Objects;
import org.kwanta.model.Parameter;

/** What a limit profile applies to: treatment regime, kind of sample point, parameter. */
public record LimitKey(TreatmentRegime regime, CycleLocation location, Parameter parameter) {

  public LimitKey {
    Objects.requireNonNull(regime, "regime");
    Objects.requireNonNull(location, "location");
    Objects.requireNonNull(parameter, "parameter");
  }

  @Override
  public String toString() {
    return regime.code() + "/" + location + "/" + parameter.code();
  }
}

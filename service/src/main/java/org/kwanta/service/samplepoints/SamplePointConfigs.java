package org.kwanta.service.samplepoints;

import java.util.Collection;
import java.util.HashMap;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.stream.Collectors;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.evaluation.CheckSettings;
import org.kwanta.model.evaluation.Regime;
import org.kwanta.model.evaluation.SamplePointConfig;
import org.kwanta.model.evaluation.Tolerances;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Repository;

/**
 * The engine's view of sample points: the configuration version in force, mapped to the model's
 * types.
 */
@Repository
public class SamplePointConfigs {

  private final JdbcClient jdbc;

  SamplePointConfigs(JdbcClient jdbc) {
    this.jdbc = jdbc;
  }

  /** A configuration and its version number. */
  public record Versioned(
      SamplePointConfig config, int version, String cycleLocation, String plantId) {}

  /** Which of the ids are registered sample points. */
  public Set<String> existing(Collection<String> ids) {
    if (ids.isEmpty()) {
      return Set.of();
    }
    return jdbc.sql("SELECT id FROM sample_point WHERE id = ANY (?::text[])")
        .param(ids.toArray(String[]::new))
        .query(String.class)
        .set();
  }

  /** The current configuration of each of the ids that exists. */
  public Map<String, Versioned> current(Collection<String> ids) {
    Map<String, Versioned> out = new HashMap<>();
    if (ids.isEmpty()) {
      return out;
    }
    jdbc.sql(
            """
            SELECT id, treatment_regime, alkalizer, operating_temperature_cel, operating_pressure_mpa,
                   version, cycle_location, plant_id
            FROM sample_point WHERE id = ANY (?::text[])""")
        .param(ids.toArray(String[]::new))
        .query(
            (rs, i) -> {
              String id = rs.getString(1);
              Double t = rs.getObject(4, Double.class);
              Double p = rs.getObject(5, Double.class);
              SamplePointConfig config =
                  new SamplePointConfig(
                      id,
                      regime(rs.getString(2)),
                      AlkalizerMix.of(Component.valueOf(rs.getString(3))),
                      (t == null ? 25.0 : t) + 273.15,
                      p == null ? Double.NaN : p * 1e6,
                      isSteam(rs.getString(7)),
                      Tolerances.defaults(),
                      CheckSettings.defaults());
              out.put(id, new Versioned(config, rs.getInt(6), rs.getString(7), rs.getString(8)));
              return id;
            })
        .list();
    return out;
  }

  /** The cycle locations whose samples are steam (evaluated at temperature as first condensate). */
  public static final Set<String> STEAM_LOCATIONS =
      Set.of("SATURATED_STEAM", "MAIN_STEAM", "REHEAT_STEAM");

  /** True for a steam cycle location (case-insensitive). */
  public static boolean isSteam(String cycleLocation) {
    return cycleLocation != null
        && STEAM_LOCATIONS.contains(cycleLocation.trim().toUpperCase(Locale.ROOT));
  }

  /**
   * Maps the registry's regime names (the trade forms AVT(R), AVT(O), OT, PT, CT, MAKE_UP; the
   * constant names AVT_R, AVT_O stored before them are read too) to the engine's.
   */
  public static Regime regime(String name) {
    String n = name.trim().toUpperCase(Locale.ROOT).replace('(', '_').replace(")", "");
    return switch (n) {
      case "AVT_R", "AVTR" -> Regime.AVT_R;
      case "AVT_O", "AVTO" -> Regime.AVT_O;
      case "OT" -> Regime.OT;
      case "PT", "PHOSPHATE" -> Regime.PHOSPHATE;
      case "CT", "CAUSTIC" -> Regime.CAUSTIC;
      case "MAKE_UP", "MAKEUP" -> Regime.MAKE_UP;
      default ->
          throw new IllegalArgumentException(
              "unknown treatment regime '"
                  + name
                  + "'; known: "
                  + java.util.Arrays.stream(org.kwanta.model.limits.TreatmentRegime.values())
                      .map(org.kwanta.model.limits.TreatmentRegime::code)
                      .collect(Collectors.joining(", ")));
    };
  }
}

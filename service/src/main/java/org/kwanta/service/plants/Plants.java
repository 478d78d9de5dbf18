package org.kwanta.service.plants;

import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.stream.Collectors;
import org.kwanta.model.conductivity.Alkalizer;
import org.kwanta.service.samplepoints.SamplePointConfigs;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Repository;
import org.springframework.transaction.annotation.Transactional;
import tools.jackson.databind.json.JsonMapper;

/** Plants, units and sample points in PostgreSQL. */
@Repository
public class Plants {

  private final JdbcClient jdbc;

  private final JsonMapper json;

  Plants(JdbcClient jdbc, JsonMapper json) {
    this.jdbc = jdbc;
    this.json = json;
  }

  static String alkalizer(PlantDeclaration.SamplePointDeclaration p) {
    return p.alkalizer() == null ? "AMMONIA" : p.alkalizer().trim().toUpperCase(Locale.ROOT);
  }

  /** Checks the names the engine must understand; returns the problems found. */
  static List<String> problems(PlantDeclaration plant) {
    List<String> problems = new java.util.ArrayList<>();
    java.util.Set<String> units =
        plant.units().stream()
            .map(PlantDeclaration.UnitDeclaration::id)
            .collect(Collectors.toSet());
    for (PlantDeclaration.SamplePointDeclaration p : plant.samplePoints()) {
      if (!units.contains(p.unit())) {
        problems.add("sample point " + p.id() + ": unknown unit '" + p.unit() + "'");
      }
      try {
        SamplePointConfigs.regime(p.treatmentRegime());
      } catch (IllegalArgumentException e) {
        problems.add("sample point " + p.id() + ": " + e.getMessage());
      }
      try {
        Alkalizer.valueOf(alkalizer(p));
      } catch (IllegalArgumentException e) {
        problems.add(
            "sample point "
                + p.id()
                + ": unknown alkalizer '"
                + p.alkalizer()
                + "'; known: "
                + java.util.Arrays.toString(Alkalizer.values()));
      }
      if (p.operatingTemperatureCel() != null
          && !(p.operatingTemperatureCel() >= 0 && p.operatingTemperatureCel() <= 350)) {
        problems.add("sample point " + p.id() + ": operatingTemperatureCel must be in [0, 350]");
      }
      if (p.operatingPressureMPa() != null
          && !(p.operatingPressureMPa() > 0 && p.operatingPressureMPa() <= 100)) {
        problems.add("sample point " + p.id() + ": operatingPressureMPa must be in (0, 100]");
      }
    }
    return problems;
  }

  public boolean exists(String plantId) {
    return jdbc.sql("SELECT count(*) FROM plant WHERE id = ?")
            .param(plantId)
            .query(Long.class)
            .single()
        > 0;
  }

  /** Stores a declared plant whole, in one transaction. */
  @Transactional
  public void insert(PlantDeclaration plant, String changedBy) {
    jdbc.sql("INSERT INTO plant (id, name) VALUES (?, ?)")
        .params(plant.id(), plant.name())
        .update();
    for (PlantDeclaration.UnitDeclaration unit : plant.units()) {
      jdbc.sql("INSERT INTO plant_unit (plant_id, id, name) VALUES (?, ?, ?)")
          .params(plant.id(), unit.id(), unit.name())
          .update();
    }
    for (PlantDeclaration.SamplePointDeclaration p : plant.samplePoints()) {
      jdbc.sql(
              """
              INSERT INTO sample_point (id, plant_id, unit_id, name, cycle_location, treatment_regime,
                                        operating_temperature_cel, operating_pressure_mpa, alkalizer,
                                        parameters, version, updated_by)
              VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?::text[], 1, ?)""")
          .params(
              p.id(),
              plant.id(),
              p.unit(),
              p.name(),
              p.cycleLocation(),
              p.treatmentRegime(),
              p.operatingTemperatureCel(),
              p.operatingPressureMPa(),
              alkalizer(p),
              (p.parameters() == null ? List.<String>of() : p.parameters()).toArray(String[]::new),
              changedBy)
          .update();
      jdbc.sql(
              """
              INSERT INTO sample_point_version (sample_point_id, version, changed_by, config)
              VALUES (?, 1, ?, ?::jsonb)""")
          .params(p.id(), changedBy, json.writeValueAsString(p))
          .update();
    }
  }

  /** One sample point's declaration. */
  public Optional<PlantDeclaration.SamplePointDeclaration> findSamplePoint(String id) {
    return jdbc.sql(
            """
            SELECT id, unit_id, name, cycle_location, treatment_regime, operating_temperature_cel,
                   operating_pressure_mpa, alkalizer, parameters
            FROM sample_point WHERE id = ?""")
        .param(id)
        .query(Plants::samplePoint)
        .optional();
  }

  private static PlantDeclaration.SamplePointDeclaration samplePoint(java.sql.ResultSet rs, int i)
      throws java.sql.SQLException {
    return new PlantDeclaration.SamplePointDeclaration(
        rs.getString(1),
        rs.getString(2),
        rs.getString(3),
        rs.getString(4),
        rs.getString(5),
        rs.getObject(6, Double.class),
        rs.getObject(7, Double.class),
        rs.getString(8),
        List.of((String[]) rs.getArray(9).getArray()));
  }

  public List<PlantSummary> list() {
    return jdbc.sql(
            """
            SELECT p.id, p.name, (SELECT count(*) FROM sample_point s WHERE s.plant_id = p.id) AS points
            FROM plant p ORDER BY p.id""")
        .query((rs, i) -> new PlantSummary(rs.getString(1), rs.getString(2), rs.getInt(3)))
        .list();
  }

  public Optional<PlantDeclaration> find(String plantId) {
    Optional<String> name =
        jdbc.sql("SELECT name FROM plant WHERE id = ?")
            .param(plantId)
            .query(String.class)
            .optional();
    return name.map(
        n ->
            new PlantDeclaration(
                plantId,
                n,
                jdbc.sql("SELECT id, name FROM plant_unit WHERE plant_id = ? ORDER BY id")
                    .param(plantId)
                    .query(
                        (rs, i) ->
                            new PlantDeclaration.UnitDeclaration(rs.getString(1), rs.getString(2)))
                    .list(),
                jdbc.sql(
                        """
                        SELECT id, unit_id, name, cycle_location, treatment_regime,
                               operating_temperature_cel, operating_pressure_mpa, alkalizer, parameters
                        FROM sample_point WHERE plant_id = ? ORDER BY id""")
                    .param(plantId)
                    .query(Plants::samplePoint)
                    .list()));
  }

  /** One line of the plant list. */
  public record PlantSummary(String id, String name, int samplePoints) {}
}

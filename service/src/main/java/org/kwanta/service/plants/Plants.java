package org.kwanta.service.plants;

import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.stream.Collectors;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.diagnosis.CoolingWater;
import org.kwanta.model.limits.PlantType;
import org.kwanta.service.audit.AuditLog;
import org.kwanta.service.samplepoints.SamplePointConfigs;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Repository;
import org.springframework.transaction.annotation.Transactional;
import tools.jackson.databind.json.JsonMapper;

/** Plants, blocks and sample points in PostgreSQL. */
@Repository
public class Plants {

  private final JdbcClient jdbc;

  private final JsonMapper json;

  private final AuditLog audit;

  Plants(JdbcClient jdbc, JsonMapper json, AuditLog audit) {
    this.jdbc = jdbc;
    this.json = json;
    this.audit = audit;
  }

  static String alkalizer(PlantDeclaration.SamplePointDeclaration p) {
    return p.alkalizer() == null ? "AMMONIA" : p.alkalizer().trim().toUpperCase(Locale.ROOT);
  }

  /** Checks the names the engine must understand; returns the problems found. */
  static List<String> problems(PlantDeclaration plant) {
    List<String> problems = new java.util.ArrayList<>();
    java.util.Set<String> blocks =
        plant.blocks().stream()
            .map(PlantDeclaration.BlockDeclaration::id)
            .collect(Collectors.toSet());
    if (plant.coolingWater() != null) {
      try {
        CoolingWater.valueOf(coolingWater(plant));
      } catch (IllegalArgumentException e) {
        problems.add(
            "unknown coolingWater '"
                + plant.coolingWater()
                + "'; known: "
                + java.util.Arrays.toString(CoolingWater.values()));
      }
    }
    if (plant.plantType() != null) {
      try {
        PlantType.ofNullable(plant.plantType());
      } catch (IllegalArgumentException e) {
        problems.add(
            "unknown plantType '"
                + plant.plantType()
                + "'; known: "
                + java.util.Arrays.toString(PlantType.values()));
      }
    }
    for (PlantDeclaration.SamplePointDeclaration p : plant.samplePoints()) {
      if (p.upstream() != null && p.upstream().contains(p.id())) {
        problems.add("sample point " + p.id() + ": cannot be upstream of itself");
      }
      if (!blocks.contains(p.block())) {
        problems.add("sample point " + p.id() + ": unknown block '" + p.block() + "'");
      }
      try {
        SamplePointConfigs.regime(p.treatmentRegime());
      } catch (IllegalArgumentException e) {
        problems.add("sample point " + p.id() + ": " + e.getMessage());
      }
      try {
        AlkalizerMix.of(Component.valueOf(alkalizer(p)));
      } catch (IllegalArgumentException e) {
        problems.add(
            "sample point "
                + p.id()
                + ": unknown alkalizer '"
                + p.alkalizer()
                + "'; known: "
                + AlkalizerMix.alkalizers());
      }
      if (p.operatingTemperatureCel() != null
          && !(p.operatingTemperatureCel() >= 0 && p.operatingTemperatureCel() <= 800)) {
        problems.add(
            "sample point "
                + p.id()
                + ": operatingTemperatureCel must be in [0, 800] (IAPWS-IF97 regions 1-3 and"
                + " IAPWS R11-07 end at 800 °C)");
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

  /** What applying a declaration changed. */
  public record Applied(boolean plantCreated, List<String> created, List<String> changed) {
    public boolean anything() {
      return plantCreated || !created.isEmpty() || !changed.isEmpty();
    }
  }

  /** Stores a new plant whole, in one transaction. */
  @Transactional
  public void insert(PlantDeclaration plant, String changedBy) {
    apply(plant, changedBy);
  }

  /**
   * Applies a declaration (configuration as code): creates what is missing; a sample point whose
   * configuration differs gets a new version, and the old versions are kept. Sample points absent
   * from the declaration are left alone. All in one transaction.
   */
  @Transactional
  public Applied apply(PlantDeclaration plant, String changedBy) {
    boolean created = false;
    if (!exists(plant.id())) {
      jdbc.sql("INSERT INTO plant (id, name, cooling_water, plant_type) VALUES (?, ?, ?, ?)")
          .params(plant.id(), plant.name(), coolingWater(plant), plantType(plant))
          .update();
      created = true;
      audit.record(
          "plant.create",
          "plant",
          plant.id(),
          null,
          java.util.Map.of(
              "name",
              plant.name(),
              "coolingWater",
              String.valueOf(coolingWater(plant)),
              "plantType",
              plantType(plant)));
    } else {
      java.util.Map<String, Object> before =
          jdbc.sql("SELECT name, cooling_water, plant_type FROM plant WHERE id = ?")
              .param(plant.id())
              .query(
                  (rs, i) ->
                      java.util.Map.<String, Object>of(
                          "name",
                          rs.getString(1),
                          "coolingWater",
                          String.valueOf(rs.getString(2)),
                          "plantType",
                          rs.getString(3)))
              .single();
      int updated =
          jdbc.sql(
                  """
                  UPDATE plant SET name = ?, cooling_water = ?, plant_type = ?
                  WHERE id = ?
                    AND (name <> ? OR cooling_water IS DISTINCT FROM ? OR plant_type <> ?)""")
              .params(
                  plant.name(),
                  coolingWater(plant),
                  plantType(plant),
                  plant.id(),
                  plant.name(),
                  coolingWater(plant),
                  plantType(plant))
              .update();
      if (updated > 0) {
        audit.record(
            "plant.update",
            "plant",
            plant.id(),
            before,
            java.util.Map.of(
                "name",
                plant.name(),
                "coolingWater",
                String.valueOf(coolingWater(plant)),
                "plantType",
                plantType(plant)));
      }
    }
    for (PlantDeclaration.BlockDeclaration block : plant.blocks()) {
      jdbc.sql(
              """
              INSERT INTO plant_block (plant_id, id, name) VALUES (?, ?, ?)
              ON CONFLICT (plant_id, id) DO UPDATE SET name = EXCLUDED.name""")
          .params(plant.id(), block.id(), block.name())
          .update();
    }
    List<String> inserted = new java.util.ArrayList<>();
    List<String> changed = new java.util.ArrayList<>();
    for (PlantDeclaration.SamplePointDeclaration declared : plant.samplePoints()) {
      PlantDeclaration.SamplePointDeclaration p = normalized(declared);
      Optional<String> owner =
          jdbc.sql("SELECT plant_id FROM sample_point WHERE id = ?")
              .param(p.id())
              .query(String.class)
              .optional();
      if (owner.isEmpty()) {
        insertSamplePoint(plant.id(), p, changedBy);
        inserted.add(p.id());
      } else if (!owner.get().equals(plant.id())) {
        throw new org.kwanta.service.system.ProblemException(
            org.springframework.http.HttpStatus.CONFLICT,
            org.kwanta.service.system.ProblemTypes.CONFLICT,
            "Conflict",
            "sample point " + p.id() + " belongs to plant " + owner.get(),
            java.util.Map.of());
      } else if (!findSamplePoint(p.id()).map(Plants::normalized).orElseThrow().equals(p)) {
        updateSamplePoint(p, changedBy);
        changed.add(p.id());
      }
    }
    return new Applied(created, inserted, changed);
  }

  private static String plantType(PlantDeclaration plant) {
    return PlantType.ofNullable(plant.plantType()).name();
  }

  private static String coolingWater(PlantDeclaration plant) {
    return plant.coolingWater() == null
        ? null
        : plant.coolingWater().trim().toUpperCase(java.util.Locale.ROOT);
  }

  /** Replaces a sample point's configuration with a new version in force from now. */
  @Transactional
  public int updateSamplePoint(PlantDeclaration.SamplePointDeclaration declared, String changedBy) {
    return updateSamplePoint(declared, changedBy, null, null);
  }

  /**
   * Replaces a sample point's configuration with a new version, in force from {@code validFrom}
   * (null: now). Versions are in force one after the other: a version may not start before the one
   * in force now started.
   *
   * @return the new version number
   * @throws VersionOrderException when validFrom precedes the start of the current version
   */
  @Transactional
  public int updateSamplePoint(
      PlantDeclaration.SamplePointDeclaration declared,
      String changedBy,
      java.time.Instant validFrom,
      String reason) {
    PlantDeclaration.SamplePointDeclaration p = normalized(declared);
    Optional<PlantDeclaration.SamplePointDeclaration> before = findSamplePoint(p.id());
    if (validFrom != null) {
      // The first version is in force from the start of the point's data (whatever its creation
      // time); a later one from its validFrom. So a change may be back-dated past the first
      // version's
      // creation, but never before a later version's start (versions stay in order).
      record Current(int version, java.time.Instant from) {}
      Current current =
          jdbc.sql(
                  """
                  SELECT version, valid_from FROM sample_point_version WHERE sample_point_id = ?
                  ORDER BY version DESC LIMIT 1 FOR UPDATE""")
              .param(p.id())
              .query((rs, i) -> new Current(rs.getInt(1), rs.getTimestamp(2).toInstant()))
              .single();
      if (current.version() > 1 && validFrom.isBefore(current.from())) {
        throw new VersionOrderException(p.id(), validFrom, current.from());
      }
    }
    Integer version =
        jdbc.sql(
                """
                UPDATE sample_point SET block_id = ?, name = ?, cycle_location = ?, treatment_regime = ?,
                    operating_temperature_cel = ?, operating_pressure_mpa = ?, alkalizer = ?,
                    parameters = ?::text[], upstream = ?::text[], version = version + 1,
                    updated_at = now(), updated_by = ?
                WHERE id = ? RETURNING version""")
            .params(
                p.block(),
                p.name(),
                p.cycleLocation(),
                p.treatmentRegime(),
                p.operatingTemperatureCel(),
                p.operatingPressureMPa(),
                p.alkalizer(),
                p.parameters().toArray(String[]::new),
                p.upstream().toArray(String[]::new),
                changedBy,
                p.id())
            .query(Integer.class)
            .single();
    jdbc.sql(
            """
            INSERT INTO sample_point_version
                (sample_point_id, version, changed_by, config, valid_from, reason)
            VALUES (?, ?, ?, ?::jsonb, coalesce(?, now()), ?)""")
        .params(
            p.id(),
            version,
            changedBy,
            json.writeValueAsString(p),
            validFrom == null ? null : java.sql.Timestamp.from(validFrom),
            reason)
        .update();
    audit.record(
        "sample-point.update",
        "sample-point",
        p.id(),
        before.map(Plants::normalized).orElse(null),
        p);
    return version;
  }

  private void insertSamplePoint(
      String plantId, PlantDeclaration.SamplePointDeclaration p, String changedBy) {
    jdbc.sql(
            """
            INSERT INTO sample_point (id, plant_id, block_id, name, cycle_location, treatment_regime,
                                      operating_temperature_cel, operating_pressure_mpa, alkalizer,
                                      parameters, upstream, version, updated_by)
            VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?::text[], ?::text[], 1, ?)""")
        .params(
            p.id(),
            plantId,
            p.block(),
            p.name(),
            p.cycleLocation(),
            p.treatmentRegime(),
            p.operatingTemperatureCel(),
            p.operatingPressureMPa(),
            p.alkalizer(),
            p.parameters().toArray(String[]::new),
            p.upstream().toArray(String[]::new),
            changedBy)
        .update();
    jdbc.sql(
            """
            INSERT INTO sample_point_version (sample_point_id, version, changed_by, config)
            VALUES (?, 1, ?, ?::jsonb)""")
        .params(p.id(), changedBy, json.writeValueAsString(p))
        .update();
    audit.record("sample-point.create", "sample-point", p.id(), null, p);
  }

  /** One version of a sample point's configuration. */
  public record Version(
      int version,
      java.time.Instant validFrom,
      String changedBy,
      String reason,
      java.time.Instant recordedAt,
      PlantDeclaration.SamplePointDeclaration config) {}

  /** A configuration version that would start before the version in force now. */
  public static final class VersionOrderException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    VersionOrderException(String point, java.time.Instant from, java.time.Instant currentFrom) {
      super(
          "the configuration of "
              + point
              + " in force now has been since "
              + currentFrom
              + "; a new version cannot be in force from an earlier time ("
              + from
              + ")");
    }
  }

  /** Every version of a sample point's configuration, oldest first. */
  public List<Version> versions(String samplePointId) {
    return jdbc.sql(
            """
            SELECT version, valid_from, changed_by, reason, recorded_at, config::text
            FROM sample_point_version WHERE sample_point_id = ? ORDER BY version""")
        .param(samplePointId)
        .query(
            (rs, i) ->
                new Version(
                    rs.getInt(1),
                    rs.getTimestamp(2).toInstant(),
                    rs.getString(3),
                    rs.getString(4),
                    rs.getTimestamp(5).toInstant(),
                    json.readValue(rs.getString(6), PlantDeclaration.SamplePointDeclaration.class)))
        .list();
  }

  static PlantDeclaration.SamplePointDeclaration normalized(
      PlantDeclaration.SamplePointDeclaration p) {
    return new PlantDeclaration.SamplePointDeclaration(
        p.id(),
        p.block(),
        p.name(),
        p.cycleLocation(),
        org.kwanta.model.limits.TreatmentRegime.canonical(p.treatmentRegime()),
        p.operatingTemperatureCel(),
        p.operatingPressureMPa(),
        alkalizer(p),
        p.parameters() == null ? List.of() : List.copyOf(p.parameters()),
        p.upstream() == null ? List.of() : List.copyOf(p.upstream()));
  }

  /** The plant a sample point belongs to. */
  public String plantOf(String samplePointId) {
    return jdbc.sql("SELECT plant_id FROM sample_point WHERE id = ?")
        .param(samplePointId)
        .query(String.class)
        .single();
  }

  /** One sample point's declaration. */
  public Optional<PlantDeclaration.SamplePointDeclaration> findSamplePoint(String id) {
    return jdbc.sql(
            """
            SELECT id, block_id, name, cycle_location, treatment_regime, operating_temperature_cel,
                   operating_pressure_mpa, alkalizer, parameters, upstream
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
        List.of((String[]) rs.getArray(9).getArray()),
        List.of((String[]) rs.getArray(10).getArray()));
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
                jdbc.sql("SELECT id, name FROM plant_block WHERE plant_id = ? ORDER BY id")
                    .param(plantId)
                    .query(
                        (rs, i) ->
                            new PlantDeclaration.BlockDeclaration(rs.getString(1), rs.getString(2)))
                    .list(),
                jdbc.sql(
                        """
                        SELECT id, block_id, name, cycle_location, treatment_regime,
                               operating_temperature_cel, operating_pressure_mpa, alkalizer, parameters,
                               upstream
                        FROM sample_point WHERE plant_id = ? ORDER BY id""")
                    .param(plantId)
                    .query(Plants::samplePoint)
                    .list(),
                coolingWater(plantId),
                plantType(plantId)));
  }

  /** The plant's declared plant type (CONVENTIONAL_DRUM when it declared none), or null. */
  public String plantType(String plantId) {
    return jdbc.sql("SELECT plant_type FROM plant WHERE id = ?")
        .param(plantId)
        .query(String.class)
        .optional()
        .orElse(null);
  }

  /** The plant's declared cooling water, or null. */
  public String coolingWater(String plantId) {
    return jdbc.sql("SELECT cooling_water FROM plant WHERE id = ?")
        .param(plantId)
        .query(String.class)
        .optional()
        .orElse(null);
  }

  /** One line of the plant list. */
  public record PlantSummary(String id, String name, int samplePoints) {}
}

package org.kwanta.service.plants;

import java.util.List;
import java.util.Optional;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Repository;
import org.springframework.transaction.annotation.Transactional;

/** Plants, units and sample points in PostgreSQL. */
@Repository
public class Plants {

  private final JdbcClient jdbc;

  Plants(JdbcClient jdbc) {
    this.jdbc = jdbc;
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
  public void insert(PlantDeclaration plant) {
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
                                        operating_temperature_cel, operating_pressure_mpa)
              VALUES (?, ?, ?, ?, ?, ?, ?, ?)""")
          .params(
              p.id(),
              plant.id(),
              p.unit(),
              p.name(),
              p.cycleLocation(),
              p.treatmentRegime(),
              p.operatingTemperatureCel(),
              p.operatingPressureMPa())
          .update();
    }
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
                               operating_temperature_cel, operating_pressure_mpa
                        FROM sample_point WHERE plant_id = ? ORDER BY id""")
                    .param(plantId)
                    .query(
                        (rs, i) ->
                            new PlantDeclaration.SamplePointDeclaration(
                                rs.getString(1),
                                rs.getString(2),
                                rs.getString(3),
                                rs.getString(4),
                                rs.getString(5),
                                rs.getObject(6, Double.class),
                                rs.getObject(7, Double.class)))
                    .list()));
  }

  /** One line of the plant list. */
  public record PlantSummary(String id, String name, int samplePoints) {}
}

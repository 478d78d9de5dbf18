package org.kwanta.model.limits;

/**
 * The kind of steam generator a plant has, where guidance differs by it (for example HRSG feedwater
 * pH under AVT(O)). A plant that declares none is a conventional drum plant.
 */
public enum PlantType {
  /** Fossil-fired drum boiler. */
  CONVENTIONAL_DRUM,
  /** Heat-recovery steam generator (combined cycle), drum type. */
  HRSG,
  /** Once-through boiler (no drum). */
  ONCE_THROUGH;

  /** The plant type of a declaration or column value; null or blank means CONVENTIONAL_DRUM. */
  public static PlantType ofNullable(String name) {
    return name == null || name.isBlank()
        ? CONVENTIONAL_DRUM
        : valueOf(name.strip().toUpperCase(java.util.Locale.ROOT));
  }
}

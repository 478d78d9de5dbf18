package org.kwanta.service.limits;

import java.io.IOException;
import java.io.InputStream;
import java.util.Collection;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.kwanta.model.Parameter;
import org.kwanta.model.limits.CycleLocation;
import org.kwanta.model.limits.LimitKey;
import org.kwanta.model.limits.LimitProfile;
import org.kwanta.model.limits.PlantType;
import org.kwanta.model.limits.TreatmentRegime;
import tools.jackson.databind.DeserializationFeature;
import tools.jackson.dataformat.yaml.YAMLMapper;

/**
 * A versioned set of default limit profiles read from a data file (for example {@code
 * limits/defaults-v1.yaml}). The defaults are examples from published guidance as recalled, not a
 * plant's limits; a plant overrides them per sample point.
 */
public final class LimitCatalog {

  /** The data file: a version, a notice, and entries that expand over regimes and locations. */
  record LimitFile(int version, String status, String notice, List<Entry> profiles) {}

  /** One entry: the same limits for several regimes and locations. */
  record Entry(
      List<PlantType> plantTypes,
      List<TreatmentRegime> regimes,
      List<CycleLocation> locations,
      String parameter,
      String unit,
      LimitDocument.Normal normal,
      List<LimitDocument.ThresholdEntry> thresholds,
      LimitDocument.Sourced deadband,
      LimitDocument.SourcedDuration persistence) {}

  private final int version;
  private final String notice;
  private final Map<LimitKey, LimitProfile> profiles;
  private final Map<PlantType, Map<LimitKey, LimitProfile>> byPlantType;

  private LimitCatalog(
      int version,
      String notice,
      Map<LimitKey, LimitProfile> profiles,
      Map<PlantType, Map<LimitKey, LimitProfile>> byPlantType) {
    this.version = version;
    this.notice = notice;
    this.profiles = profiles;
    this.byPlantType = byPlantType;
  }

  /**
   * Reads and validates a limit data file.
   *
   * @throws IllegalArgumentException naming the entry when an entry is incomplete, has a value
   *     without a source, a unit that is not the parameter's canonical unit, thresholds out of
   *     order, or repeats a (regime, location, parameter) of an earlier entry
   */
  public static LimitCatalog read(InputStream in) throws IOException {
    YAMLMapper mapper =
        YAMLMapper.builder().enable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES).build();
    LimitFile file = mapper.readValue(in, LimitFile.class);
    if (file.version() < 1 || file.notice() == null || file.notice().isBlank()) {
      throw new IllegalArgumentException("A limit file needs a version >= 1 and a notice");
    }
    Map<LimitKey, LimitProfile> profiles = new LinkedHashMap<>();
    Map<PlantType, Map<LimitKey, LimitProfile>> byPlantType = new EnumMap<>(PlantType.class);
    for (Entry e : file.profiles()) {
      LimitDocument doc =
          new LimitDocument(
              e.parameter(), e.unit(), e.normal(), e.thresholds(), e.deadband(), e.persistence());
      Parameter parameter = doc.parameterOrThrow();
      if (e.regimes() == null
          || e.regimes().isEmpty()
          || e.locations() == null
          || e.locations().isEmpty()) {
        throw new IllegalArgumentException(
            "Limits for " + parameter.code() + ": 'regimes' and 'locations' must not be empty");
      }
      if (e.plantTypes() != null && e.plantTypes().isEmpty()) {
        throw new IllegalArgumentException(
            "Limits for " + parameter.code() + ": 'plantTypes' must be omitted or not empty");
      }
      for (TreatmentRegime regime : e.regimes()) {
        for (CycleLocation location : e.locations()) {
          LimitKey key = new LimitKey(regime, location, parameter);
          if (e.plantTypes() == null) {
            if (profiles.put(key, doc.toProfile(key)) != null) {
              throw new IllegalArgumentException("Limits for " + key + " are given twice");
            }
            continue;
          }
          for (PlantType type : e.plantTypes()) {
            if (byPlantType
                    .computeIfAbsent(type, t -> new LinkedHashMap<>())
                    .put(key, doc.toProfile(key))
                != null) {
              throw new IllegalArgumentException(
                  "Limits for " + key + " (" + type + ") are given twice");
            }
          }
        }
      }
    }
    Map<PlantType, Map<LimitKey, LimitProfile>> specific = new EnumMap<>(PlantType.class);
    byPlantType.forEach((t, m) -> specific.put(t, Map.copyOf(m)));
    return new LimitCatalog(
        file.version(), file.notice().strip(), Map.copyOf(profiles), Map.copyOf(specific));
  }

  /** The data file's version. */
  public int version() {
    return version;
  }

  /** The file's notice: what the values are and how far they can be trusted. */
  public String notice() {
    return notice;
  }

  /**
   * The profile for a key that applies to any plant type (entries without {@code plantTypes}), if
   * the defaults have one; for a conventional drum plant use {@link #find(LimitKey, PlantType)}.
   */
  public Optional<LimitProfile> find(LimitKey key) {
    return Optional.ofNullable(profiles.get(key));
  }

  /**
   * The profile for a key at a plant of a type: an entry for that plant type if there is one,
   * otherwise the entry for any plant type. A null type is {@link PlantType#CONVENTIONAL_DRUM}.
   */
  public Optional<LimitProfile> find(LimitKey key, PlantType plantType) {
    PlantType type = plantType == null ? PlantType.CONVENTIONAL_DRUM : plantType;
    LimitProfile specific = byPlantType.getOrDefault(type, Map.of()).get(key);
    return specific != null ? Optional.of(specific) : find(key);
  }

  /** Every profile that applies to any plant type. */
  public Collection<LimitProfile> profiles() {
    return profiles.values();
  }

  /** Every profile that applies only to plants of a type (in addition to {@link #profiles()}). */
  public Collection<LimitProfile> profiles(PlantType plantType) {
    return byPlantType.getOrDefault(plantType, Map.of()).values();
  }
}

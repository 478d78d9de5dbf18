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
import org.kwanta.model.diagnosis.CoolingWater;
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

  /**
   * The data file: a version, a notice, entries that expand over regimes and locations, and
   * (version 3 on) guidance that no measured parameter carries, listed but never classified.
   */
  record LimitFile(
      int version, String status, String notice, List<Entry> profiles, List<Guidance> guidance) {}

  /**
   * One entry: the same limits for several regimes and locations; optionally only for some plant
   * types and/or for a band of drum pressure, or (version 4 on) only for plants of some cooling
   * waters.
   */
  record Entry(
      List<PlantType> plantTypes,
      PressureBand drumPressureMPa,
      List<CoolingWater> coolingWaters,
      List<TreatmentRegime> regimes,
      List<CycleLocation> locations,
      String parameter,
      String unit,
      LimitDocument.Normal normal,
      List<LimitDocument.ThresholdEntry> thresholds,
      LimitDocument.Sourced deadband,
      LimitDocument.SourcedDuration persistence) {}

  /**
   * A band of drum pressure, MPa: above {@code above} (exclusive; omitted: from 0) up to {@code
   * upTo} (inclusive; omitted: no upper end). Matched against the drum pressure of a sample point
   * (its operating pressure, or the saturation pressure at its operating temperature).
   */
  public record PressureBand(Double above, Double upTo) {

    /** Whether a pressure (MPa) lies in the band; an unknown pressure (null) lies in none. */
    public boolean contains(Double pressureMPa) {
      return pressureMPa != null
          && (above == null || pressureMPa > above)
          && (upTo == null || pressureMPa <= upTo);
    }

    boolean overlaps(PressureBand o) {
      double lo = above == null ? Double.NEGATIVE_INFINITY : above;
      double hi = upTo == null ? Double.POSITIVE_INFINITY : upTo;
      double oLo = o.above == null ? Double.NEGATIVE_INFINITY : o.above;
      double oHi = o.upTo == null ? Double.POSITIVE_INFINITY : o.upTo;
      return lo < oHi && oLo < hi;
    }

    @Override
    public String toString() {
      return "(" + (above == null ? "0" : above) + ", " + (upTo == null ? "∞" : upTo) + "] MPa";
    }
  }

  /**
   * Guidance that no measured parameter carries (for example phosphate treatment's Na:PO4 molar
   * ratio): listed with the defaults, never classified.
   */
  public record Guidance(
      String topic,
      List<TreatmentRegime> regimes,
      List<CycleLocation> locations,
      String value,
      String source) {}

  /**
   * A profile that applies in a band of drum pressure.
   *
   * @param plantTypes the plant types it applies to; empty: every plant type
   */
  public record Banded(List<PlantType> plantTypes, PressureBand band, LimitProfile profile) {

    boolean appliesTo(LimitKey key, PlantType type, Double pressureMPa, boolean typed) {
      return profile.key().equals(key)
          && (typed ? plantTypes.contains(type) : plantTypes.isEmpty())
          && band.contains(pressureMPa);
    }
  }

  private final int version;
  private final String notice;
  private final Map<LimitKey, LimitProfile> profiles;
  private final Map<PlantType, Map<LimitKey, LimitProfile>> byPlantType;
  private final List<Banded> banded;
  private final Map<CoolingWater, Map<LimitKey, LimitProfile>> byCoolingWater;
  private final List<Guidance> guidance;

  private LimitCatalog(
      int version,
      String notice,
      Map<LimitKey, LimitProfile> profiles,
      Map<PlantType, Map<LimitKey, LimitProfile>> byPlantType,
      List<Banded> banded,
      Map<CoolingWater, Map<LimitKey, LimitProfile>> byCoolingWater,
      List<Guidance> guidance) {
    this.version = version;
    this.notice = notice;
    this.profiles = profiles;
    this.byPlantType = byPlantType;
    this.banded = banded;
    this.byCoolingWater = byCoolingWater;
    this.guidance = guidance;
  }

  /**
   * Reads and validates a limit data file.
   *
   * @throws IllegalArgumentException naming the entry when an entry is incomplete, has a value
   *     without a source, a unit that is not the parameter's canonical unit, thresholds out of
   *     order, repeats a (regime, location, parameter) of an earlier entry, has a drum pressure
   *     band that is not a band or overlaps another of the same key and plant types, names cooling
   *     waters together with plant types or a band, or guidance without a source
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
    List<Banded> banded = new java.util.ArrayList<>();
    Map<CoolingWater, Map<LimitKey, LimitProfile>> byCoolingWater =
        new EnumMap<>(CoolingWater.class);
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
      if (e.coolingWaters() != null
          && (e.coolingWaters().isEmpty()
              || e.plantTypes() != null
              || e.drumPressureMPa() != null)) {
        throw new IllegalArgumentException(
            "Limits for "
                + parameter.code()
                + ": 'coolingWaters' must not be empty and cannot be combined with 'plantTypes'"
                + " or 'drumPressureMPa'");
      }
      if (e.drumPressureMPa() != null) {
        PressureBand b = e.drumPressureMPa();
        if ((b.above() == null && b.upTo() == null)
            || (b.above() != null && !(b.above() >= 0))
            || (b.upTo() != null && !(b.upTo() > 0))
            || (b.above() != null && b.upTo() != null && !(b.upTo() > b.above()))) {
          throw new IllegalArgumentException(
              "Limits for " + parameter.code() + ": drum pressure band " + b + " is not a band");
        }
      }
      for (TreatmentRegime regime : e.regimes()) {
        for (CycleLocation location : e.locations()) {
          LimitKey key = new LimitKey(regime, location, parameter);
          if (e.coolingWaters() != null) {
            for (CoolingWater water : e.coolingWaters()) {
              if (byCoolingWater
                      .computeIfAbsent(water, w -> new LinkedHashMap<>())
                      .put(key, doc.toProfile(key))
                  != null) {
                throw new IllegalArgumentException(
                    "Limits for " + key + " (" + water + " cooling water) are given twice");
              }
            }
            continue;
          }
          if (e.drumPressureMPa() != null) {
            Banded add =
                new Banded(
                    e.plantTypes() == null ? List.of() : List.copyOf(e.plantTypes()),
                    e.drumPressureMPa(),
                    doc.toProfile(key));
            for (Banded b : banded) {
              if (b.profile().key().equals(key)
                  && sameScope(b, add)
                  && b.band().overlaps(add.band())) {
                throw new IllegalArgumentException(
                    "Limits for "
                        + key
                        + ": drum pressure bands "
                        + b.band()
                        + " and "
                        + add.band()
                        + " overlap");
              }
            }
            banded.add(add);
            continue;
          }
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
    Map<CoolingWater, Map<LimitKey, LimitProfile>> cooled = new EnumMap<>(CoolingWater.class);
    byCoolingWater.forEach((w, m) -> cooled.put(w, Map.copyOf(m)));
    List<Guidance> guidance = file.guidance() == null ? List.of() : List.copyOf(file.guidance());
    for (Guidance g : guidance) {
      if (g.topic() == null
          || g.value() == null
          || g.source() == null
          || g.source().isBlank()
          || g.regimes() == null
          || g.regimes().isEmpty()
          || g.locations() == null
          || g.locations().isEmpty()) {
        throw new IllegalArgumentException(
            "Guidance '" + g.topic() + "' needs a topic, regimes, locations, a value and a source");
      }
    }
    return new LimitCatalog(
        file.version(),
        file.notice().strip(),
        Map.copyOf(profiles),
        Map.copyOf(specific),
        List.copyOf(banded),
        Map.copyOf(cooled),
        guidance);
  }

  /**
   * Whether two banded entries compete for the same plants: both for any plant type, or both for
   * plant types they share (an entry for a plant type wins over one for any type, so those never
   * compete).
   */
  private static boolean sameScope(Banded a, Banded b) {
    return a.plantTypes().isEmpty()
        ? b.plantTypes().isEmpty()
        : !java.util.Collections.disjoint(a.plantTypes(), b.plantTypes());
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
    return find(key, plantType, null);
  }

  /**
   * The profile for a key at a plant of a type and a drum pressure, the first of: an entry for that
   * plant type whose drum pressure band holds the pressure; an entry for that plant type without a
   * band; an entry for any plant type whose band holds the pressure; an entry for any plant type
   * without a band. A null type is {@link PlantType#CONVENTIONAL_DRUM}; a null pressure (unknown)
   * matches no band.
   */
  public Optional<LimitProfile> find(LimitKey key, PlantType plantType, Double drumPressureMPa) {
    return find(key, plantType, drumPressureMPa, null);
  }

  /**
   * The profile for a key at a plant of a type, a drum pressure and a cooling water: an entry for
   * that cooling water if there is one, otherwise as {@link #find(LimitKey, PlantType, Double)}. A
   * null cooling water (the plant declares none) matches no cooling-water entry.
   */
  public Optional<LimitProfile> find(
      LimitKey key, PlantType plantType, Double drumPressureMPa, CoolingWater coolingWater) {
    if (coolingWater != null) {
      LimitProfile cooled = byCoolingWater.getOrDefault(coolingWater, Map.of()).get(key);
      if (cooled != null) {
        return Optional.of(cooled);
      }
    }
    PlantType type = plantType == null ? PlantType.CONVENTIONAL_DRUM : plantType;
    for (Banded b : banded) {
      if (b.appliesTo(key, type, drumPressureMPa, true)) {
        return Optional.of(b.profile());
      }
    }
    LimitProfile specific = byPlantType.getOrDefault(type, Map.of()).get(key);
    if (specific != null) {
      return Optional.of(specific);
    }
    for (Banded b : banded) {
      if (b.appliesTo(key, type, drumPressureMPa, false)) {
        return Optional.of(b.profile());
      }
    }
    return find(key);
  }

  /** Every profile that applies in a band of drum pressure, in file order. */
  public List<Banded> banded() {
    return banded;
  }

  /** Guidance without a measured parameter (listed, never classified). */
  public List<Guidance> guidance() {
    return guidance;
  }

  /** Every profile that applies to any plant type. */
  public Collection<LimitProfile> profiles() {
    return profiles.values();
  }

  /**
   * Every profile that applies only to plants with a cooling water (in addition to {@link
   * #profiles()}; version 4 on).
   */
  public Collection<LimitProfile> profiles(CoolingWater coolingWater) {
    return byCoolingWater.getOrDefault(coolingWater, Map.of()).values();
  }

  /** Every profile that applies only to plants of a type (in addition to {@link #profiles()}). */
  public Collection<LimitProfile> profiles(PlantType plantType) {
    return byPlantType.getOrDefault(plantType, Map.of()).values();
  }
}

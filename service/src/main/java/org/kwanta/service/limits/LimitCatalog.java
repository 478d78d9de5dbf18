package org.kwanta.service.limits;

import java.io.IOException;
import java.io.InputStream;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.kwanta.model.limits.CycleLocation;
import org.kwanta.model.limits.LimitKey;
import org.kwanta.model.limits.LimitProfile;
import org.kwanta.model.limits.Parameter;
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

  private LimitCatalog(int version, String notice, Map<LimitKey, LimitProfile> profiles) {
    this.version = version;
    this.notice = notice;
    this.profiles = profiles;
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
      for (TreatmentRegime regime : e.regimes()) {
        for (CycleLocation location : e.locations()) {
          LimitKey key = new LimitKey(regime, location, parameter);
          if (profiles.put(key, doc.toProfile(key)) != null) {
            throw new IllegalArgumentException("Limits for " + key + " are given twice");
          }
        }
      }
    }
    return new LimitCatalog(file.version(), file.notice().strip(), Map.copyOf(profiles));
  }

  /** The data file's version. */
  public int version() {
    return version;
  }

  /** The file's notice: what the values are and how far they can be trusted. */
  public String notice() {
    return notice;
  }

  /** The profile for a key, if the defaults have one. */
  public Optional<LimitProfile> find(LimitKey key) {
    return Optional.ofNullable(profiles.get(key));
  }

  /** Every profile. */
  public Collection<LimitProfile> profiles() {
    return profiles.values();
  }
}

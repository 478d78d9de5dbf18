package org.kwanta.model.aqueous;

import static org.kwanta.model.aqueous.EquilibriumConstants.*;

import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The default constant set and the alternatives the pH band is evaluated over. Set ids are short
 * ids of our own ("ammonium-2": the default with fit ammonium-2); the description of each set names
 * the sources, and each fit's {@link Fit#reference()} carries the full citation.
 *
 * <p>Default (the project's reference notes, §10 superseding §3/§4): NH4⁺ llnl.dat; amines the
 * recommended three-term rows; CO2 K1 and K2 Plummer &amp; Busenberg 1982; HSO4⁻ Dickson 1990;
 * H3PO4 K1-K3 llnl.dat; acetic and formic acid Harned forms to 60 °C, llnl fits above; boric acid
 * Mesmer 1972 Q11 with the pKw in use.
 */
public final class ConstantSets {

  private ConstantSets() {}

  /** The default set. */
  public static final ConstantSet DEFAULT = buildDefault();

  private static ConstantSet buildDefault() {
    Map<Equilibrium, List<Fit>> m = new HashMap<>();
    // the choices, where the catalogue holds more than one fit of an equilibrium
    m.put(Equilibrium.AMMONIUM, List.of(AMMONIUM_LLNL));
    m.put(Equilibrium.ofWeakBase(Component.MORPHOLINE), List.of(MORPHOLINIUM_RIDLEY));
    m.put(Equilibrium.ofWeakBase(Component.ETHANOLAMINE), List.of(ETHANOLAMMONIUM_RECOMMENDED));
    m.put(Equilibrium.ofWeakBase(Component.DIMETHYLAMINE), List.of(DIMETHYLAMMONIUM_BENEZETH));
    m.put(Equilibrium.BISULFATE, List.of(BISULFATE_DICKSON));
    m.put(Equilibrium.CARBONIC_FIRST, List.of(CARBONIC_FIRST_PLUMMER_BUSENBERG));
    m.put(Equilibrium.CARBONIC_SECOND, List.of(CARBONIC_SECOND_PLUMMER_BUSENBERG));
    m.put(Equilibrium.PHOSPHORIC_FIRST, List.of(PHOSPHORIC_FIRST_LLNL));
    m.put(Equilibrium.PHOSPHORIC_SECOND, List.of(PHOSPHORIC_SECOND_LLNL));
    m.put(Equilibrium.PHOSPHORIC_THIRD, List.of(PHOSPHORIC_THIRD_LLNL));
    m.put(Equilibrium.ACETIC, List.of(ACETIC_HARNED, ACETIC_LLNL));
    m.put(Equilibrium.FORMIC, List.of(FORMIC_HARNED, FORMIC_LLNL));
    // every other equilibrium has a single fit in the catalogue, and the default uses it
    for (Fit fit : EquilibriumConstants.all()) {
      Equilibrium e = fit.equilibrium();
      if (!m.containsKey(e) && onlyFitOf(e)) {
        m.put(e, List.of(fit));
      }
    }
    return new ConstantSet(
        "default",
        "ammonium llnl.dat; amines three-term (recommended dCp); carbonic acid Plummer-Busenberg"
            + " 1982; bisulfate Dickson 1990; phosphoric acid llnl.dat; acetic/formic Harned to 60"
            + " °C then llnl; boric acid Mesmer 1972",
        m);
  }

  private static boolean onlyFitOf(Equilibrium e) {
    return EquilibriumConstants.all().stream().filter(f -> f.equilibrium() == e).count() == 1;
  }

  /** The alternatives to {@link #DEFAULT}, each differing in one source or one database. */
  public static List<ConstantSet> alternatives() {
    return ALTERNATIVES;
  }

  /** {@link #DEFAULT} followed by {@link #alternatives()}. */
  public static List<ConstantSet> all() {
    return ALL;
  }

  /** The set with a given {@link ConstantSet#id()}. */
  public static ConstantSet byId(String id) {
    for (ConstantSet s : ALL) {
      if (s.id().equals(id)) {
        return s;
      }
    }
    throw new IllegalArgumentException("no constant set with id " + id);
  }

  private static final List<ConstantSet> ALTERNATIVES =
      List.of(
          one("ammonium-2", Equilibrium.AMMONIUM, AMMONIUM_THERMODDEM),
          one(
              "ammonium-3",
              Equilibrium.AMMONIUM,
              AMMONIUM_BATES_PINCHING,
              "extrapolated above 50 °C"),
          one("ammonium-4", Equilibrium.AMMONIUM, AMMONIUM_EDWARDS, "to 225 °C"),
          one("morpholinium-2", Equilibrium.ofWeakBase(Component.MORPHOLINE), MORPHOLINIUM_ZERO_CP),
          one(
              "ethanolammonium-2",
              Equilibrium.ofWeakBase(Component.ETHANOLAMINE),
              ETHANOLAMMONIUM_ZERO_CP),
          one(
              "dimethylammonium-2",
              Equilibrium.ofWeakBase(Component.DIMETHYLAMINE),
              DIMETHYLAMMONIUM_NIST46_ZERO_CP,
              "the old row; 25 °C data only"),
          DEFAULT.with(
              "carbonic-2",
              "carbonic acid K1 and K2 from llnl.dat instead of Plummer-Busenberg 1982",
              Map.of(
                  Equilibrium.CARBONIC_FIRST, List.of(CARBONIC_FIRST_LLNL),
                  Equilibrium.CARBONIC_SECOND, List.of(CARBONIC_SECOND_LLNL))),
          one("bisulfate-2", Equilibrium.BISULFATE, BISULFATE_LLNL),
          DEFAULT.with(
              "phosphoric-2",
              "phosphoric acid K1-K3 from Thermoddem instead of llnl.dat",
              Map.of(
                  Equilibrium.PHOSPHORIC_FIRST, List.of(PHOSPHORIC_FIRST_THERMODDEM),
                  Equilibrium.PHOSPHORIC_SECOND, List.of(PHOSPHORIC_SECOND_THERMODDEM),
                  Equilibrium.PHOSPHORIC_THIRD, List.of(PHOSPHORIC_THIRD_THERMODDEM))),
          DEFAULT.with(
              "organic-acids-2",
              "acetic and formic acid from the llnl fits at every temperature",
              Map.of(
                  Equilibrium.ACETIC, List.of(ACETIC_LLNL),
                  Equilibrium.FORMIC, List.of(FORMIC_LLNL))),
          DEFAULT.with(
              "organic-acids-1",
              "acetic and formic acid from the Harned forms at every temperature (extrapolated"
                  + " above 60 °C)",
              Map.of(
                  Equilibrium.ACETIC, List.of(ACETIC_HARNED),
                  Equilibrium.FORMIC, List.of(FORMIC_HARNED))),
          DEFAULT.with(
              "hkf-fits",
              "every equilibrium the HKF-based database llnl.dat has: ammonium, carbonic acid K1/K2,"
                  + " bisulfate, phosphoric acid, acetic, formic",
              Map.of(
                  Equilibrium.CARBONIC_FIRST, List.of(CARBONIC_FIRST_LLNL),
                  Equilibrium.CARBONIC_SECOND, List.of(CARBONIC_SECOND_LLNL),
                  Equilibrium.BISULFATE, List.of(BISULFATE_LLNL),
                  Equilibrium.ACETIC, List.of(ACETIC_LLNL),
                  Equilibrium.FORMIC, List.of(FORMIC_LLNL))),
          DEFAULT.with(
              "ammonium-phosphoric-2",
              "ammonium and phosphoric acid K1-K3 from Thermoddem (its carbonic-acid and bisulfate"
                  + " coefficients are not transcribed)",
              Map.of(
                  Equilibrium.AMMONIUM, List.of(AMMONIUM_THERMODDEM),
                  Equilibrium.PHOSPHORIC_FIRST, List.of(PHOSPHORIC_FIRST_THERMODDEM),
                  Equilibrium.PHOSPHORIC_SECOND, List.of(PHOSPHORIC_SECOND_THERMODDEM),
                  Equilibrium.PHOSPHORIC_THIRD, List.of(PHOSPHORIC_THIRD_THERMODDEM))));

  private static final List<ConstantSet> ALL = buildAll();

  private static List<ConstantSet> buildAll() {
    var list = new java.util.ArrayList<ConstantSet>();
    list.add(DEFAULT);
    list.addAll(ALTERNATIVES);
    return List.copyOf(list);
  }

  private static ConstantSet one(String id, Equilibrium e, Fit fit) {
    return one(id, e, fit, null);
  }

  private static ConstantSet one(String id, Equilibrium e, Fit fit, String remark) {
    String d =
        e.reaction()
            + " from fit "
            + fit.id()
            + ": "
            + fit.reference().id()
            + (remark == null ? "" : " (" + remark + ")");
    return DEFAULT.with(id, d, Map.of(e, List.of(fit)));
  }
}

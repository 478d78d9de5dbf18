package org.kwanta.model.aqueous;

import static org.kwanta.model.aqueous.EquilibriumConstants.*;

import java.util.EnumMap;
import java.util.List;
import java.util.Map;

/**
 * The default constant set and the named alternatives the pH band is evaluated over.
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
    Map<Equilibrium, List<Fit>> m = new EnumMap<>(Equilibrium.class);
    m.put(Equilibrium.AMMONIUM, List.of(AMMONIUM_LLNL));
    m.put(Equilibrium.MORPHOLINIUM, List.of(MORPHOLINIUM_RIDLEY));
    m.put(Equilibrium.ETHANOLAMMONIUM, List.of(ETHANOLAMMONIUM_RECOMMENDED));
    m.put(Equilibrium.CYCLOHEXYLAMMONIUM, List.of(CYCLOHEXYLAMMONIUM_ESTIMATE));
    m.put(Equilibrium.DIMETHYLAMMONIUM, List.of(DIMETHYLAMMONIUM_BENEZETH));
    m.put(Equilibrium.METHOXYPROPYLAMMONIUM, List.of(METHOXYPROPYLAMMONIUM_ESTIMATE));
    m.put(Equilibrium.DIETHYLAMINOETHANOLIUM, List.of(DIETHYLAMINOETHANOLIUM_ESTIMATE));
    m.put(Equilibrium.BISULFATE, List.of(BISULFATE_DICKSON));
    m.put(Equilibrium.CARBONIC_FIRST, List.of(CARBONIC_FIRST_PLUMMER_BUSENBERG));
    m.put(Equilibrium.CARBONIC_SECOND, List.of(CARBONIC_SECOND_PLUMMER_BUSENBERG));
    m.put(Equilibrium.PHOSPHORIC_FIRST, List.of(PHOSPHORIC_FIRST_LLNL));
    m.put(Equilibrium.PHOSPHORIC_SECOND, List.of(PHOSPHORIC_SECOND_LLNL));
    m.put(Equilibrium.PHOSPHORIC_THIRD, List.of(PHOSPHORIC_THIRD_LLNL));
    m.put(Equilibrium.ACETIC, List.of(ACETIC_HARNED, ACETIC_LLNL));
    m.put(Equilibrium.FORMIC, List.of(FORMIC_HARNED, FORMIC_LLNL));
    m.put(Equilibrium.BORIC, List.of(BORIC_MESMER));
    return new ConstantSet(
        "default",
        "NH4+ llnl.dat; amines three-term (recommended dCp); CO2 Plummer-Busenberg 1982; HSO4-"
            + " Dickson 1990; H3PO4 llnl.dat; acetic/formic Harned to 60 °C then llnl; B(OH)3"
            + " Mesmer 1972",
        m);
  }

  /** The alternatives to {@link #DEFAULT}, each differing in one source or one database. */
  public static List<ConstantSet> alternatives() {
    return ALTERNATIVES;
  }

  /** {@link #DEFAULT} followed by {@link #alternatives()}. */
  public static List<ConstantSet> all() {
    return ALL;
  }

  /** The set with a given name. */
  public static ConstantSet byName(String name) {
    for (ConstantSet s : ALL) {
      if (s.name().equals(name)) {
        return s;
      }
    }
    throw new IllegalArgumentException("no constant set named " + name);
  }

  private static final List<ConstantSet> ALTERNATIVES =
      List.of(
          one("NH4+ Thermoddem", Equilibrium.AMMONIUM, AMMONIUM_THERMODDEM),
          one(
              "NH4+ Bates-Pinching 1949",
              Equilibrium.AMMONIUM,
              AMMONIUM_BATES_PINCHING,
              "extrapolated above 50 °C"),
          one("NH4+ Edwards 1978", Equilibrium.AMMONIUM, AMMONIUM_EDWARDS, "to 225 °C"),
          one("morpholine dCp 0", Equilibrium.MORPHOLINIUM, MORPHOLINIUM_ZERO_CP),
          one("ethanolamine dCp 0", Equilibrium.ETHANOLAMMONIUM, ETHANOLAMMONIUM_ZERO_CP),
          one(
              "dimethylamine NIST46 dCp 0",
              Equilibrium.DIMETHYLAMMONIUM,
              DIMETHYLAMMONIUM_NIST46_ZERO_CP,
              "the old row; 25 °C data only"),
          DEFAULT.with(
              "CO2 llnl.dat",
              "CO2 K1 and K2 from llnl.dat instead of Plummer-Busenberg 1982",
              Map.of(
                  Equilibrium.CARBONIC_FIRST, List.of(CARBONIC_FIRST_LLNL),
                  Equilibrium.CARBONIC_SECOND, List.of(CARBONIC_SECOND_LLNL))),
          one("HSO4- llnl.dat", Equilibrium.BISULFATE, BISULFATE_LLNL),
          DEFAULT.with(
              "H3PO4 Thermoddem",
              "H3PO4 K1-K3 from Thermoddem instead of llnl.dat",
              Map.of(
                  Equilibrium.PHOSPHORIC_FIRST, List.of(PHOSPHORIC_FIRST_THERMODDEM),
                  Equilibrium.PHOSPHORIC_SECOND, List.of(PHOSPHORIC_SECOND_THERMODDEM),
                  Equilibrium.PHOSPHORIC_THIRD, List.of(PHOSPHORIC_THIRD_THERMODDEM))),
          DEFAULT.with(
              "organic acids llnl",
              "acetic and formic acid from the llnl fits at every temperature",
              Map.of(
                  Equilibrium.ACETIC, List.of(ACETIC_LLNL),
                  Equilibrium.FORMIC, List.of(FORMIC_LLNL))),
          DEFAULT.with(
              "organic acids Harned",
              "acetic and formic acid from the Harned forms at every temperature (extrapolated"
                  + " above 60 °C)",
              Map.of(
                  Equilibrium.ACETIC, List.of(ACETIC_HARNED),
                  Equilibrium.FORMIC, List.of(FORMIC_HARNED))),
          DEFAULT.with(
              "llnl.dat throughout",
              "every equilibrium llnl.dat has: NH4+, CO2 K1/K2, HSO4-, H3PO4, acetic, formic",
              Map.of(
                  Equilibrium.CARBONIC_FIRST, List.of(CARBONIC_FIRST_LLNL),
                  Equilibrium.CARBONIC_SECOND, List.of(CARBONIC_SECOND_LLNL),
                  Equilibrium.BISULFATE, List.of(BISULFATE_LLNL),
                  Equilibrium.ACETIC, List.of(ACETIC_LLNL),
                  Equilibrium.FORMIC, List.of(FORMIC_LLNL))),
          DEFAULT.with(
              "Thermoddem where transcribed",
              "NH4+ and H3PO4 K1-K3 from Thermoddem (its CO2 and HSO4- coefficients are not"
                  + " transcribed)",
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

  private static ConstantSet one(String name, Equilibrium e, Fit fit) {
    return one(name, e, fit, null);
  }

  private static ConstantSet one(String name, Equilibrium e, Fit fit, String remark) {
    String d = e.reaction() + " from " + fit.id() + (remark == null ? "" : " (" + remark + ")");
    return DEFAULT.with(name, d, Map.of(e, List.of(fit)));
  }
}

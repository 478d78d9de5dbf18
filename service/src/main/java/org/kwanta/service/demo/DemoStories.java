package org.kwanta.service.demo;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.conductivity.Conductivity;
import org.kwanta.model.conductivity.Equilibria;
import org.kwanta.model.conductivity.Solutes;
import org.kwanta.model.conductivity.Solution;
import org.kwanta.model.conductivity.SolutionModel;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;
import org.kwanta.service.ingest.ReadingInput;

/**
 * Invented readings for the fictional Brackenmoor plant (demo only, no real plant's data).
 * Compositions are invented; the conductivities and pH that an analyser would show for them come
 * from the engine's own solution model at the sample temperature, so the instruments agree with
 * each other unless a story says otherwise. The stories repeat every {@code period} (default 8 h;
 * times below for that period, with a day of back-fill at start so every point has its baseline):
 *
 * <ol>
 *   <li>normal day: Unit 1 feedwater on ammonia at pH25 ≈ 9.7;
 *   <li>condenser leak, Unit 2, 1–3.5 h: sodium, chloride and sulfate in brackish-water proportions
 *       climb at U2-CPD, the economizer inlet and drums;
 *   <li>exhausted cation column on Unit 1 main steam, 2.5–5 h: cation conductivity creeps up while
 *       sodium and the neighbouring steam points stay put;
 *   <li>drifting pH electrode on Unit 1 feedwater, 4.5–7.5 h: measured pH falls away from the
 *       calculated one at 0.06 pH/h, then is recalibrated;
 *   <li>start-up with air in-leakage, 0–1.5 h: carbon dioxide at U1-CPD (which has a degassed
 *       channel) and the economizer inlet, degassed cation conductivity normal.
 * </ol>
 */
final class DemoStories {

  static final double MG_NH3 = 1.0 / 17.031 / 1000;
  static final double UG_CL = 1.0 / 35.453 / 1e6;
  static final double UG_NA = 1.0 / 22.98977 / 1e6;
  static final double UG_CO2 = 1.0 / 44.009 / 1e6;
  static final double MG_PO4 = 1.0 / 94.971 / 1000;
  static final double UG_SO4 = 1.0 / 96.06 / 1e6;

  private final Duration period;
  private final Map<Long, SolutionModel> models = new ConcurrentHashMap<>();

  DemoStories(Duration period) {
    this.period = period;
  }

  /** Position in the story cycle, 0 to 1. */
  double phase(Instant t) {
    long p = period.toMillis();
    return Math.floorMod(t.toEpochMilli(), p) / (double) p;
  }

  /**
   * A smooth bump rising over [start, start + width/2] and falling back by start + width; 0
   * outside.
   */
  static double bump(double phase, double start, double width) {
    double x = (phase - start) / width;
    return x <= 0 || x >= 1 ? 0 : Math.sin(Math.PI * x);
  }

  /** The readings of every demo sample point at time t. */
  List<ReadingInput> at(Instant t) {
    double ph = phase(t);
    double noise =
        Math.sin(t.getEpochSecond() / 37.0) * 0.5 + Math.sin(t.getEpochSecond() / 11.0) * 0.5;
    // hours into the story cycle, scaled so that the default 8 h period gives the times below
    double h = ph * 8;
    double air = bump(h, 0.0, 1.5); // story 5: start-up with air in-leakage, 0–1.5 h
    double leak = bump(h, 1.0, 2.5); // story 2: condenser leak, 1–3.5 h
    double column = h > 2.5 && h < 5.0 ? (h - 2.5) / 2.5 : 0; // story 3: creeps 2.5–5 h, then fresh
    double drift = h > 4.5 && h < 7.5 ? -0.06 * (h - 4.5) : 0; // story 4: −0.06 pH/h, 4.5–7.5 h
    List<ReadingInput> out = new ArrayList<>();
    double sampleT = 25.0 + 0.4 * noise;
    // Unit 1
    volatilePoint(
        out,
        "U1-CPD",
        t,
        sampleT,
        new Solutes(2.8 * MG_NH3, 0.3 * UG_NA, 2 * UG_CL, 0, (8 + 350 * air) * UG_CO2, 0),
        true,
        true,
        true,
        false,
        noise,
        0);
    volatilePoint(
        out,
        "U1-ECO-IN",
        t,
        sampleT,
        new Solutes(3.0 * MG_NH3, 0.3 * UG_NA, 2 * UG_CL, 0, (6 + 200 * air) * UG_CO2, 0),
        true,
        true,
        false,
        true,
        noise,
        drift);
    volatilePoint(
        out,
        "U1-LP-DRUM",
        t,
        sampleT,
        new Solutes(1.2 * MG_NH3, 2 * UG_NA, 8 * UG_CL, 0, 3 * UG_CO2, 0),
        true,
        false,
        false,
        true,
        noise,
        0);
    volatilePoint(
        out,
        "U1-IP-DRUM",
        t,
        sampleT,
        new Solutes(0.9 * MG_NH3, 3 * UG_NA, 12 * UG_CL, 0, 2 * UG_CO2, 0),
        true,
        false,
        false,
        true,
        noise,
        0);
    volatilePoint(
        out,
        "U1-HP-DRUM",
        t,
        sampleT,
        new Solutes(0.6 * MG_NH3, 5 * UG_NA, 20 * UG_CL, 0, 1 * UG_CO2, 0),
        true,
        false,
        false,
        true,
        noise,
        0);
    volatilePoint(
        out,
        "U1-HP-SAT",
        t,
        sampleT,
        new Solutes(2.9 * MG_NH3, 0.3 * UG_NA, 1 * UG_CL, 0, 5 * UG_CO2, 0),
        false,
        false,
        true,
        false,
        noise,
        0);
    exhaustedColumnPoint(out, "U1-MS", t, sampleT, column, noise);
    volatilePoint(
        out,
        "U1-RH",
        t,
        sampleT,
        new Solutes(2.9 * MG_NH3, 0.3 * UG_NA, 1 * UG_CL, 0, 5 * UG_CO2, 0),
        false,
        true,
        true,
        false,
        noise,
        0);
    // Unit 2: the condenser leak enters at the condensate pump and travels on, diluted by nothing
    // brackish estuary water: sea-salt proportions (Millero et al. 2008: per µg/kg sodium 1.795
    // µg/kg chloride and 0.2516 µg/kg sulfate)
    double na = 0.4 + 14 * leak;
    double cl = 2 + 14 * leak * 1.795;
    double so4 = 14 * leak * 0.2516 * UG_SO4;
    volatilePoint(
        out,
        "U2-CPD",
        t,
        sampleT,
        new Solutes(2.8 * MG_NH3, na * UG_NA, cl * UG_CL, so4, 8 * UG_CO2, 0),
        true,
        false,
        true,
        false,
        noise,
        0);
    volatilePoint(
        out,
        "U2-ECO-IN",
        t,
        sampleT,
        new Solutes(3.0 * MG_NH3, na * UG_NA, cl * UG_CL, so4, 6 * UG_CO2, 0),
        true,
        true,
        false,
        true,
        noise,
        0);
    volatilePoint(
        out,
        "U2-LP-DRUM",
        t,
        sampleT,
        new Solutes(1.2 * MG_NH3, 4 * na * UG_NA, 4 * cl * UG_CL, 4 * so4, 3 * UG_CO2, 0),
        true,
        false,
        false,
        true,
        noise,
        0);
    volatilePoint(
        out,
        "U2-IP-DRUM",
        t,
        sampleT,
        new Solutes(0.9 * MG_NH3, 6 * na * UG_NA, 6 * cl * UG_CL, 6 * so4, 2 * UG_CO2, 0),
        true,
        false,
        false,
        true,
        noise,
        0);
    phosphateDrum(out, "U2-HP-DRUM", t, sampleT, 8 * cl, noise);
    volatilePoint(
        out,
        "U2-HP-SAT",
        t,
        sampleT,
        new Solutes(2.9 * MG_NH3, 0.3 * UG_NA, 1 * UG_CL, 0, 5 * UG_CO2, 0),
        false,
        false,
        true,
        false,
        noise,
        0);
    volatilePoint(
        out,
        "U2-MS",
        t,
        sampleT,
        new Solutes(2.9 * MG_NH3, 0.3 * UG_NA, 1 * UG_CL, 0, 5 * UG_CO2, 0),
        false,
        true,
        true,
        false,
        noise,
        0);
    volatilePoint(
        out,
        "U2-RH",
        t,
        sampleT,
        new Solutes(2.9 * MG_NH3, 0.3 * UG_NA, 1 * UG_CL, 0, 5 * UG_CO2, 0),
        false,
        true,
        true,
        false,
        noise,
        0);
    // make-up water after the mixed bed
    Solution mu =
        model(sampleT).solve(new Solutes(0, 0.02 * UG_NA, 0.03 * UG_CL, 0, 0.5 * UG_CO2, 0));
    out.add(reading("MU-DEMIN", "specific_conductivity", t, mu.kappa(), "uS/cm", sampleT, false));
    out.add(reading("MU-DEMIN", "silica", t, 5 + 0.5 * noise, "ug/kg", null, null));
    out.add(reading("MU-DEMIN", "sample_temperature", t, sampleT, "Cel", null, null));
    return out;
  }

  private void volatilePoint(
      List<ReadingInput> out,
      String id,
      Instant t,
      double sampleT,
      Solutes s,
      boolean specific,
      boolean degassed,
      boolean sodium,
      boolean ph,
      double noise,
      double phOffset) {
    SolutionModel m = model(sampleT);
    SolutionModel m25 = model(25.0);
    Solution all = m.solve(s);
    if (specific) {
      out.add(
          reading(
              id,
              "specific_conductivity",
              t,
              all.kappa() * (1 + 0.003 * noise),
              "uS/cm",
              sampleT,
              false));
    }
    double cation =
        m25.solve(new Solutes(0, 0, s.chloride(), s.sulfate(), s.carbonate(), s.phosphate()))
            .kappa();
    out.add(
        reading(id, "cation_conductivity", t, cation * (1 + 0.01 * noise), "uS/cm", null, true));
    if (degassed) {
      double dcc =
          m25.solve(new Solutes(0, 0, s.chloride(), s.sulfate(), 0, s.phosphate())).kappa();
      out.add(
          reading(
              id,
              "degassed_cation_conductivity",
              t,
              dcc * (1 + 0.01 * noise),
              "uS/cm",
              null,
              true));
    }
    if (sodium) {
      out.add(
          reading(id, "sodium", t, s.sodium() / UG_NA * (1 + 0.02 * noise), "ug/kg", null, null));
    }
    if (ph) {
      double ph25 = m25.solve(s).pH();
      out.add(reading(id, "ph", t, ph25 + phOffset + 0.01 * noise, "[pH]", null, null));
    }
    out.add(reading(id, "sample_temperature", t, sampleT, "Cel", null, null));
  }

  /** Story 3: the cation column lets through a growing part of the ammonium. */
  private void exhaustedColumnPoint(
      List<ReadingInput> out, String id, Instant t, double sampleT, double column, double noise) {
    Solutes s = new Solutes(2.9 * MG_NH3, 0.3 * UG_NA, 1 * UG_CL, 0, 5 * UG_CO2, 0);
    double sc = model(sampleT).solve(s).kappa() * (1 + 0.004 * noise + 0.12 * column);
    double sc25 = model(25.0).solve(s).kappa() * (1 + 0.12 * column);
    double leak = 0.002 + 0.03 * column;
    double cation = model(25.0).solve(new Solutes(0, 0, s.chloride(), 0, s.carbonate(), 0)).kappa();
    double dcc = model(25.0).solve(new Solutes(0, 0, s.chloride(), 0, 0, 0)).kappa();
    out.add(reading(id, "specific_conductivity", t, sc, "uS/cm", sampleT, false));
    out.add(reading(id, "cation_conductivity", t, cation + leak * sc25, "uS/cm", null, true));
    out.add(reading(id, "degassed_cation_conductivity", t, dcc + leak * sc25, "uS/cm", null, true));
    out.add(reading(id, "sodium", t, 0.3 * (1 + 0.03 * noise), "ug/kg", null, null));
    out.add(reading(id, "sample_temperature", t, sampleT, "Cel", null, null));
  }

  /** Unit 2 HP drum on trisodium phosphate (Na:PO4 = 3), 1.0 mg/kg phosphate. */
  private void phosphateDrum(
      List<ReadingInput> out,
      String id,
      Instant t,
      double sampleT,
      double chlorideUg,
      double noise) {
    double po4 = 1.0 * MG_PO4;
    Solutes s = new Solutes(0.3 * MG_NH3, 3 * po4, chlorideUg * UG_CL, 0, 1 * UG_CO2, po4);
    Solution all = model(sampleT).solve(s);
    double cation =
        model(25.0)
            .solve(new Solutes(0, 0, s.chloride() + s.sodium() - 3 * po4, 0, s.carbonate(), po4))
            .kappa();
    out.add(
        reading(
            id,
            "specific_conductivity",
            t,
            all.kappa() * (1 + 0.003 * noise),
            "uS/cm",
            sampleT,
            false));
    out.add(
        reading(id, "cation_conductivity", t, cation * (1 + 0.01 * noise), "uS/cm", null, true));
    out.add(reading(id, "ph", t, model(25.0).solve(s).pH() + 0.01 * noise, "[pH]", null, null));
    out.add(reading(id, "phosphate", t, 1000 * (1 + 0.01 * noise), "ug/kg", null, null));
    out.add(reading(id, "sodium", t, s.sodium() / UG_NA * (1 + 0.01 * noise), "ug/kg", null, null));
    out.add(reading(id, "sample_temperature", t, sampleT, "Cel", null, null));
  }

  private SolutionModel model(double celsius) {
    long key = Math.round(celsius * 100);
    return models.computeIfAbsent(
        key,
        k -> {
          WaterState w =
              Water.at(
                  k / 100.0 + 273.15, Water.ATMOSPHERIC_PRESSURE_PA, IonizationFormulation.R11_07);
          return new SolutionModel(Conductivity.at(w), Equilibria.of(w), AlkalizerMix.AMMONIA);
        });
  }

  private static ReadingInput reading(
      String point,
      String parameter,
      Instant t,
      double value,
      String unit,
      Double sampleT,
      Boolean compensated) {
    double rounded = Double.parseDouble(String.format(Locale.ROOT, "%.5g", value));
    return new ReadingInput(
        point, parameter, t.toString(), rounded, unit, "good", sampleT, compensated);
  }
}

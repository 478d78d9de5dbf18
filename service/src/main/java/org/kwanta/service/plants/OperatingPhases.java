package org.kwanta.service.plants;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.kwanta.model.OutOfValidityRangeException;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;
import org.kwanta.service.samplepoints.SamplePointConfigs;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.system.ProblemTypes;
import org.springframework.http.HttpStatus;

/**
 * A declared cycle location must agree with the phase of water at the declared operating
 * temperature and pressure (IAPWS-IF97): a steam location (saturated, main or reheat steam) must
 * not be liquid, a liquid location (condensate, feedwater, drum water, make-up) must not be steam.
 * Below the critical pressure the test is against the saturation temperature with 1 K of slack
 * (declared values are rounded, and saturated steam sits on the line); at or above it, against the
 * critical density (liquid-like or not). Points without both a temperature and a pressure are not
 * checked.
 */
final class OperatingPhases {

  /** Slack on the saturation temperature, K (Kwanta's choice, for rounded declared values). */
  static final double SLACK_K = 1.0;

  private OperatingPhases() {}

  /** The contradictions found, one message per sample point. */
  static List<String> conflicts(PlantDeclaration plant) {
    List<String> out = new ArrayList<>();
    for (PlantDeclaration.SamplePointDeclaration p : plant.samplePoints()) {
      if (p.operatingTemperatureCel() == null || p.operatingPressureMPa() == null) {
        continue;
      }
      String conflict =
          conflict(
              p.id(), p.cycleLocation(), p.operatingTemperatureCel(), p.operatingPressureMPa());
      if (conflict != null) {
        out.add(conflict);
      }
    }
    return out;
  }

  /** 422 naming every contradiction, when there is one. */
  static void require(PlantDeclaration plant) {
    List<String> conflicts = conflicts(plant);
    if (!conflicts.isEmpty()) {
      throw new ProblemException(
          HttpStatus.UNPROCESSABLE_CONTENT,
          ProblemTypes.VALIDATION,
          "Cycle location contradicts the operating state",
          String.join("; ", conflicts),
          Map.of("problems", conflicts));
    }
  }

  static String conflict(String id, String location, double celsius, double pressureMPa) {
    boolean steamLocation = SamplePointConfigs.isSteam(location);
    double t = celsius + 273.15;
    double p = pressureMPa * 1e6;
    WaterState w;
    try {
      w = Water.at(t, p, IonizationFormulation.R11_07);
    } catch (OutOfValidityRangeException e) {
      return null; // the range problems are reported by Plants.problems
    }
    boolean liquid;
    String reason;
    if (p < 22.064e6) {
      double tSat = Water.saturationTemperatureK(p);
      liquid = steamLocation ? t < tSat - SLACK_K : !(t > tSat + SLACK_K);
      reason =
          String.format(
              Locale.ROOT,
              "the saturation temperature at %s MPa is %.1f °C (IAPWS-IF97)",
              trim(pressureMPa),
              tSat - 273.15);
    } else {
      liquid = w.liquidLike();
      reason =
          String.format(
              Locale.ROOT,
              "above the critical pressure the density is %.0f kg/m3 (IAPWS-IF97; liquid-like from"
                  + " 322 kg/m3)",
              w.densityKgPerM3());
    }
    if (steamLocation && liquid) {
      return String.format(
          Locale.ROOT,
          "sample point %s: cycleLocation %s at %s °C and %s MPa is liquid water (%s); give the"
              + " steam's own temperature and pressure",
          id,
          location,
          trim(celsius),
          trim(pressureMPa),
          reason);
    }
    if (!steamLocation && !liquid) {
      return String.format(
          Locale.ROOT,
          "sample point %s: cycleLocation %s at %s °C and %s MPa is steam (%s); a liquid sample"
              + " point needs a liquid operating state",
          id,
          location,
          trim(celsius),
          trim(pressureMPa),
          reason);
    }
    return null;
  }

  private static String trim(double v) {
    return java.math.BigDecimal.valueOf(v).stripTrailingZeros().toPlainString();
  }
}

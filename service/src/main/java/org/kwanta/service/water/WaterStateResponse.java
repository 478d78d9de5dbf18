package org.kwanta.service.water;

import io.swagger.v3.oas.annotations.media.Schema;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.kwanta.model.water.Phase;
import org.kwanta.model.water.PressureSource;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;

/**
 * Water at one (T, p), units in every field name, and the formulation behind each number. A value
 * that means nothing at the state is null, and {@code notices} says why.
 */
@Schema(description = "Properties of water at one temperature and pressure")
record WaterStateResponse(
    @Schema(example = "300") double temperatureCel,
    @Schema(example = "573.15") double temperatureK,
    @Schema(example = "8.587708") double pressureMPa,
    @Schema(description = "GIVEN, SATURATION, or ATMOSPHERIC_FLOOR (saturation below 0.101325 MPa)")
        PressureSource pressureSource,
    @Schema(example = "8.587708", description = "null above the critical temperature")
        Double saturationPressureMPa,
    @Schema(
            description =
                "IF97 region and phase: LIQUID_REGION_1, VAPOUR_REGION_2, LIQUID_REGION_3,"
                    + " VAPOUR_REGION_3 or SUPERCRITICAL_REGION_3")
        Phase phase,
    @Schema(example = "712.14") double densityKgPerM3,
    @Schema(example = "11.339") double pKw,
    @Schema(
            example = "5.670",
            description =
                "pKw/2, molal activity scale; null in states less dense than the critical density,"
                    + " where a liquid pH scale does not apply")
        Double neutralPh,
    @Schema(example = "20.14", description = "null above 873 K (IAPWS R8-97's limit)")
        Double relativePermittivity,
    @Schema(
            description =
                "Debye–Hückel A, molal, log10, unit kg^(1/2)·mol^(-1/2); null where not meaningful",
            example = "1.242")
        Double debyeHuckelAKgHalfPerMolHalf,
    @Schema(
            description =
                "Debye–Hückel B, molal, unit Å^(-1)·kg^(1/2)·mol^(-1/2); null where not meaningful",
            example = "0.395")
        Double debyeHuckelBPerAngstromKgHalfPerMolHalf,
    @Schema(description = "What the reader must know about this state (empty for ordinary liquid)")
        List<String> notices,
    Formulations formulations) {

  /** Which published formulation produced each number. */
  record Formulations(
      String density,
      String saturationPressure,
      String pKw,
      String relativePermittivity,
      String debyeHuckel) {}

  static final String STEAM_PH_NOTICE =
      "vapour-like state (density below the critical density 322 kg/m3): pKw is that of the"
          + " fluid at this density, but a pH scale in steam is not a liquid pH; no neutral pH and"
          + " no Debye–Hückel parameters are given (Kwanta's convention)";

  static WaterStateResponse from(WaterState s) {
    List<String> notices = new ArrayList<>(2);
    boolean liquidLike = s.liquidLike();
    if (!liquidLike) {
      notices.add(STEAM_PH_NOTICE);
    }
    if (Double.isNaN(s.relativePermittivity())) {
      notices.add(
          String.format(
              Locale.ROOT,
              "no relative permittivity above 873 K (IAPWS R8-97's limit); the state is at %.2f K",
              s.temperatureK()));
    }
    if (liquidLike && s.phase() != Phase.LIQUID_REGION_1) {
      notices.add(
          "liquid-like state above 623.15 K (IF97 region 3): the speciation engine's equilibrium"
              + " constants end at 350 °C");
    }
    return new WaterStateResponse(
        s.temperatureK() - 273.15,
        s.temperatureK(),
        s.pressurePa() / 1e6,
        s.pressureSource(),
        finite(s.saturationPressurePa() / 1e6),
        s.phase(),
        s.densityKgPerM3(),
        s.pKw(),
        liquidLike ? s.neutralPh() : null,
        finite(s.relativePermittivity()),
        finite(s.debyeHuckelA()),
        finite(s.debyeHuckelB()),
        List.copyOf(notices),
        new Formulations(
            "IAPWS-IF97 (R7-97(2012)) " + region(s.phase()),
            "IAPWS-IF97 (R7-97(2012)) region 4",
            IonizationNames.label(s.ionization()),
            "IAPWS R8-97",
            "Debye–Hückel A and B from IAPWS R8-97 permittivity, IF97 density and CODATA 2018"
                + " constants; given from "
                + (int) Water.LIQUID_LIKE_DENSITY.min()
                + " kg/m3 (Kwanta)"));
  }

  private static String region(Phase p) {
    return switch (p) {
      case LIQUID_REGION_1 -> "region 1";
      case VAPOUR_REGION_2 -> "region 2";
      case LIQUID_REGION_3, VAPOUR_REGION_3, SUPERCRITICAL_REGION_3 -> "region 3";
    };
  }

  private static Double finite(double v) {
    return Double.isFinite(v) ? v : null;
  }
}

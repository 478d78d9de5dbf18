package org.kwanta.service.chemistry;

import io.swagger.v3.oas.annotations.media.Schema;
import java.util.List;
import org.kwanta.model.aqueous.ConstantUsed;
import org.kwanta.model.aqueous.Notice;
import org.kwanta.model.aqueous.PhBand;
import org.kwanta.model.aqueous.SpeciationReport;
import org.kwanta.model.aqueous.SpeciationResult;
import org.kwanta.model.aqueous.SpeciesAmount;
import org.kwanta.model.water.PressureSource;
import org.kwanta.model.water.WaterState;
import org.kwanta.service.water.IonizationNames;

/**
 * Speciation of one water at one or more temperatures. pH values are on the molal activity scale,
 * pH = −log10 a(H⁺); units are in the field names.
 */
@Schema(description = "Speciation of one water at one or more temperatures (advisory)")
record SpeciationResponse(
    @Schema(description = "the totals as given and as used") List<ComponentTotal> composition,
    @Schema(example = "davies") String activityModel,
    @Schema(example = "Davies 1962") String activityModelSource,
    @Schema(description = "constant set of the main result", example = "default")
        String constantSet,
    @Schema(example = "liquid") String sampleOrigin,
    @Schema(example = "IAPWS R11-07") String pKwFormulation,
    @Schema(description = "one result per requested temperature, in request order")
        List<AtTemperature> results) {

  static SpeciationResponse from(SpeciationInputs.Parsed in, List<SpeciationReport> reports) {
    return new SpeciationResponse(
        in.totals(),
        SpeciationInputs.apiName(in.options().activityModel()),
        in.options().activityModel().reference().id(),
        in.options().constants().id(),
        SpeciationInputs.apiName(in.options().sampleOrigin()),
        IonizationNames.label(in.ionization()),
        reports.stream().map(AtTemperature::from).toList());
  }

  /** The speciation at one temperature, the 25 °C pH of the same water and the band. */
  @Schema(name = "SpeciationAtTemperature", description = "The speciation at one temperature")
  record AtTemperature(
      @Schema(example = "330") double temperatureCel,
      @Schema(example = "603.15") double temperatureK,
      @Schema(example = "12.864") double pressureMPa,
      @Schema(
              description =
                  "GIVEN, SATURATION, or ATMOSPHERIC_FLOOR (saturation below 0.101325 MPa)")
          PressureSource pressureSource,
      @Schema(description = "pH at temperature, molal activity scale", example = "5.93")
          double phAtTemperature,
      @Schema(description = "−log10 Kw at (T, p)", example = "11.594") double pKw,
      @Schema(description = "pKw/2", example = "5.797") double neutralPh,
      @Schema(example = "0.13") double phMinusNeutral,
      @Schema(example = "1.2e-5") double ionicStrengthMolPerKg,
      double hydrogenIonMolalityMolPerKg,
      double hydroxideMolalityMolPerKg,
      @Schema(
              description = "pH at 25 °C and 0.101325 MPa of the same water (same totals)",
              example = "9.34")
          double phAt25Cel,
      Band band,
      List<SpeciesRow> species,
      @Schema(description = "every equilibrium constant used, components present only")
          List<ConstantRow> constants,
      List<NoticeRow> notices,
      @Schema(description = "|Σ z m| / Σ |z| m at the solution", example = "1e-16")
          double chargeBalanceRelativeResidual,
      @Schema(
              description =
                  "the pH at temperature's uncertainty itemised; here (a) and (d) do not apply"
                      + " (given totals at a given state), (b) is the band above")
          PhUncertaintyView uncertainty) {

    static AtTemperature from(SpeciationReport report) {
      SpeciationResult r = report.atTemperature();
      WaterState w = r.water();
      return new AtTemperature(
          w.temperatureK() - 273.15,
          w.temperatureK(),
          w.pressurePa() / 1e6,
          w.pressureSource(),
          r.ph(),
          r.pKw(),
          r.neutralPh(),
          r.phMinusNeutral(),
          r.ionicStrengthMolPerKg(),
          r.hydrogenIonMolality(),
          r.hydroxideMolality(),
          report.at25Celsius().ph(),
          Band.from(report.band()),
          r.species().stream().map(SpeciesRow::from).toList(),
          r.constants().stream().map(ConstantRow::from).toList(),
          r.notices().stream().sorted().map(NoticeRow::from).toList(),
          r.chargeBalanceRelativeResidual(),
          PhUncertaintyView.from(report.uncertainty()));
    }
  }

  /** pH at temperature over the alternative constant sets. */
  @Schema(
      name = "PhBand",
      description = "pH at temperature over every distinct alternative constant set")
  record Band(
      @Schema(example = "5.93") double minPh,
      @Schema(example = "ammonium-2") String minConstantSet,
      @Schema(example = "6.13") double maxPh,
      @Schema(example = "ammonium-3") String maxConstantSet,
      @Schema(example = "0.20") double widthPh,
      List<Member> members) {

    /** One evaluated set. */
    @Schema(name = "PhBandMember")
    record Member(String constantSet, double ph, boolean extrapolated) {}

    static Band from(PhBand b) {
      return new Band(
          b.minPh(),
          b.minSet(),
          b.maxPh(),
          b.maxSet(),
          b.width(),
          b.members().stream()
              .map(m -> new Member(m.constantSet(), m.ph(), m.extrapolated()))
              .toList());
    }
  }

  /** One species. */
  @Schema(name = "SpeciesAmount")
  record SpeciesRow(
      @Schema(example = "ammonium") String species,
      @Schema(description = "formula without charge (see chargeNumber)", example = "NH4")
          String formula,
      @Schema(example = "ammonia") String component,
      @Schema(example = "1") int chargeNumber,
      double molalityMolPerKg,
      @Schema(description = "share of the component's total, 0-1") double fractionOfComponent,
      @Schema(description = "molal activity coefficient") double activityCoefficient) {

    static SpeciesRow from(SpeciesAmount a) {
      return new SpeciesRow(
          a.species().name().toLowerCase(java.util.Locale.ROOT),
          a.species().formula(),
          SpeciationInputs.apiName(a.species().component()),
          a.species().chargeNumber(),
          a.molalityMolPerKg(),
          a.fractionOfComponent(),
          a.activityCoefficient());
    }
  }

  /** One equilibrium constant as used. */
  @Schema(name = "ConstantUsed")
  record ConstantRow(
      @Schema(example = "ammonium") String equilibrium,
      @Schema(example = "NH₄⁺ ⇌ NH₃ + H⁺") String reaction,
      @Schema(description = "log10 Ka, dissociation direction, molal", example = "-5.6")
          double log10K,
      @Schema(description = "id of the fit; its source is in citation", example = "ammonium-1")
          String sourceId,
      String citation,
      @Schema(description = "VERIFIED_BY_CHECK_TABLE, RETRIEVED, FROM_MEMORY or ESTIMATED")
          String confidence,
      @Schema(description = "lower end of the fit's stated range, °C") double validFromCel,
      @Schema(description = "upper end of the fit's stated range, °C") double validToCel,
      @Schema(description = "true when evaluated outside the fit's stated range")
          boolean extrapolated) {

    static ConstantRow from(ConstantUsed c) {
      return new ConstantRow(
          c.equilibrium().name().toLowerCase(java.util.Locale.ROOT),
          c.equilibrium().reaction(),
          c.log10K(),
          c.sourceId(),
          c.reference().citation(),
          c.reference().confidence().name(),
          celsius(c.validity().min()),
          celsius(c.validity().max()),
          c.extrapolated());
    }

    private static double celsius(double kelvin) {
      return Math.round((kelvin - 273.15) * 1e6) / 1e6;
    }
  }

  /** Something to read beside the numbers. */
  @Schema(name = "SpeciationNotice")
  record NoticeRow(@Schema(example = "EXTRAPOLATED_CONSTANT") String code, String text) {

    static NoticeRow from(Notice n) {
      return new NoticeRow(
          n.name(),
          switch (n) {
            case EXTRAPOLATED_CONSTANT ->
                "At least one equilibrium constant was evaluated outside its fit's stated"
                    + " temperature range (see constants[].extrapolated).";
            case IONIC_STRENGTH_ABOVE_ACTIVITY_MODEL_RANGE ->
                "The ionic strength exceeds the range to which the activity model is customarily"
                    + " adequate (0.1 mol/kg).";
            case CONDENSED_LIQUID_AT_STATED_TEMPERATURE ->
                "Steam sample: speciated as its condensate, a liquid at the stated temperature;"
                    + " the pH is that of the condensate, not of the vapour.";
          });
    }
  }
}

package org.kwanta.service.chemistry;

import com.fasterxml.jackson.annotation.JsonInclude;
import io.swagger.v3.oas.annotations.media.Schema;
import java.util.List;
import org.kwanta.model.aqueous.AssociationUsed;
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
      @Schema(description = "pH at temperature (molal activity scale) with its band")
          PhAtTemperature phAtTemperature,
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
      List<SpeciesRow> species,
      @Schema(description = "every equilibrium constant used, components present only")
          List<ConstantRow> constants,
      @Schema(
              description =
                  "ion pairs and polyborates carried, with their constants (empty when none"
                      + " applies or ionAssociation is false)")
          List<AssociationRow> associations,
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
          PhAtTemperature.of(r.ph(), report.band(), true),
          r.pKw(),
          r.neutralPh(),
          r.phMinusNeutral(),
          r.ionicStrengthMolPerKg(),
          r.hydrogenIonMolality(),
          r.hydroxideMolality(),
          report.at25Celsius().ph(),
          r.species().stream().map(SpeciesRow::from).toList(),
          r.constants().stream().map(ConstantRow::from).toList(),
          r.associations().stream().map(AssociationRow::from).toList(),
          r.notices().stream().sorted().map(NoticeRow::from).toList(),
          r.chargeBalanceRelativeResidual(),
          PhUncertaintyView.from(report.uncertainty()));
    }
  }

  /**
   * pH at temperature with its band, the one shape of {@code phAtTemperature} in every response
   * (the evaluation's adds the state it is at; docs/names.md). Here the band is over the
   * alternative published constant sets ({@code bandFrom} CONSTANT_SETS).
   *
   * @param ph pH of the main result (the chosen constant set), molal activity scale
   * @param low lowest pH over the constant sets
   * @param high highest pH over the constant sets
   * @param bandFrom what the band spans: CONSTANT_SETS
   * @param lowConstantSet the set that gave {@code low}
   * @param highConstantSet the set that gave {@code high}
   * @param members every evaluated set (absent from the curve's rows)
   */
  @Schema(
      name = "SpeciationPhAtTemperature",
      description = "pH at temperature with its band (bandFrom CONSTANT_SETS)")
  @JsonInclude(JsonInclude.Include.NON_NULL)
  record PhAtTemperature(
      @Schema(example = "5.945") double ph,
      @Schema(example = "5.891") double low,
      @Schema(example = "6.077") double high,
      @Schema(example = "CONSTANT_SETS") String bandFrom,
      @Schema(example = "ammonium-2") String lowConstantSet,
      @Schema(example = "ammonium-3") String highConstantSet,
      List<Member> members) {

    /** What a band over the alternative constant sets is from. */
    static final String CONSTANT_SETS = "CONSTANT_SETS";

    /** One evaluated set. */
    @Schema(name = "PhBandMember")
    record Member(String constantSet, double ph, boolean extrapolated) {}

    static PhAtTemperature of(double ph, PhBand b, boolean withMembers) {
      return new PhAtTemperature(
          ph,
          b.minPh(),
          b.maxPh(),
          CONSTANT_SETS,
          b.minSet(),
          b.maxSet(),
          withMembers
              ? b.members().stream()
                  .map(m -> new Member(m.constantSet(), m.ph(), m.extrapolated()))
                  .toList()
              : null);
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

    static double celsius(double kelvin) {
      return Math.round((kelvin - 273.15) * 1e6) / 1e6;
    }
  }

  /** One association constant (ion pair or polyborate) as used. */
  @Schema(name = "AssociationUsed")
  record AssociationRow(
      @Schema(example = "sodium_chloride") String association,
      @Schema(example = "Na⁺ + Cl⁻ ⇌ NaCl°") String reaction,
      @Schema(
              description =
                  "log10 of the constant as the source writes it (association constant of an ion"
                      + " pair, OH⁻-based quotient of a polyborate), molal",
              example = "1.0")
          double log10K,
      @Schema(example = "nacl-pair-1") String sourceId,
      String citation,
      @Schema(description = "VERIFIED_BY_CHECK_TABLE, RETRIEVED, FROM_MEMORY or ESTIMATED")
          String confidence,
      @Schema(description = "lower end of the fit's stated range, °C") double validFromCel,
      @Schema(description = "upper end of the fit's stated range, °C") double validToCel,
      @Schema(description = "true when evaluated outside the fit's stated range")
          boolean extrapolated) {

    static AssociationRow from(AssociationUsed a) {
      return new AssociationRow(
          a.association().name().toLowerCase(java.util.Locale.ROOT),
          a.association().reaction(),
          a.log10K(),
          a.association().id(),
          a.reference().citation(),
          a.reference().confidence().name(),
          ConstantRow.celsius(a.validity().min()),
          ConstantRow.celsius(a.validity().max()),
          a.extrapolated());
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
            case EXTRAPOLATED_ASSOCIATION_CONSTANT ->
                "At least one ion-pair or polyborate constant was evaluated outside its fit's"
                    + " stated temperature range (see associations[].extrapolated; the"
                    + " polyborates are fitted at 50-200 °C only).";
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

package org.kwanta.service.chemistry;

import io.swagger.v3.oas.annotations.media.Schema;
import java.util.List;
import java.util.Locale;
import org.kwanta.model.conductivity.ForwardConductivity;

/**
 * Specific, cation and degassed cation conductivity of a water at 25 °C and, when asked, at a
 * sample temperature, with each ion's share. Units are in the field names.
 */
@Schema(description = "Forward conductivity of one water (advisory)")
record ConductivityResponse(
    @Schema(description = "the totals as given and as used") List<ComponentTotal> composition,
    @Schema(description = "the channels at 25 °C") Channels at25Cel,
    @Schema(description = "the channels at the sample temperature (null when none was given)")
        Channels atSampleTemperature,
    @Schema(description = "remarks on the model's range for this water") List<String> notices,
    @Schema(description = "the model and its sources") String model) {

  static final String MODEL =
      "Charge balance with the speciation engine's default constants and Davies activity"
          + " coefficients; κ = Σ c|z|λ with λ° at 25 °C (CRC), λ°(T) by Walden's rule with the"
          + " PHREEQC dw_T term, and the Debye–Hückel–Onsager limiting law. Cation channel: a"
          + " strong-acid cation exchanger in the H⁺ form (the anions as their acids); degassed"
          + " cation channel: the same with all carbon dioxide removed. Checked against ASTM D5128"
          + " Table 1 and ASTM D4519 Table 2.";

  /** Molar ionic strength above which the Onsager limiting law is outside its range, mol/L. */
  static final double ONSAGER_LIMIT_MOL_PER_L = 1e-3;

  static ConductivityResponse from(
      List<ComponentTotal> totals,
      ForwardConductivity.Channels at25,
      ForwardConductivity.Channels atSample) {
    List<String> notices = new java.util.ArrayList<>();
    for (ForwardConductivity.Channels c :
        atSample == null ? List.of(at25) : List.of(at25, atSample)) {
      if (c.molarIonicStrength() > ONSAGER_LIMIT_MOL_PER_L) {
        notices.add(
            String.format(
                Locale.ROOT,
                "At %.1f °C the ionic strength %.2g mol/L exceeds the limiting law's 1e-3 mol/L:"
                    + " conductivities are less certain (high).",
                c.temperatureK() - 273.15,
                c.molarIonicStrength()));
      }
    }
    return new ConductivityResponse(
        totals,
        Channels.from(at25),
        atSample == null ? null : Channels.from(atSample),
        List.copyOf(notices),
        MODEL);
  }

  /** The three channels at one temperature. */
  @Schema(name = "ConductivityChannels")
  record Channels(
      @Schema(example = "25") double temperatureCel,
      Channel specific,
      Channel cation,
      Channel degassedCation) {

    static Channels from(ForwardConductivity.Channels c) {
      return new Channels(
          Math.round((c.temperatureK() - 273.15) * 1e6) / 1e6,
          Channel.from(c.specific()),
          Channel.from(c.cation()),
          Channel.from(c.degassedCation()));
    }
  }

  /** One channel: the water it sees, its conductivity and pH, and each ion's share. */
  @Schema(name = "ConductivityChannel")
  record Channel(
      @Schema(example = "5.79") double conductivityUSPerCm,
      @Schema(description = "pH of the water the channel sees, at the temperature", example = "9.2")
          double ph,
      @Schema(example = "6.1e-5") double ionicStrengthMolPerKg,
      @Schema(description = "each ion present, largest share first") List<IonShare> ions) {

    static Channel from(ForwardConductivity.Channel c) {
      return new Channel(
          c.kappa(),
          c.solution().pH(),
          c.solution().ionicStrength(),
          c.contributions().stream().map(x -> IonShare.from(x, c.kappa())).toList());
    }
  }

  /** One ion's share of a channel's conductivity. */
  @Schema(name = "IonConductivityShare")
  record IonShare(
      @Schema(example = "ammonium") String species,
      @Schema(example = "NH4") String formula,
      @Schema(example = "1") int chargeNumber,
      double molalityMolPerKg,
      @Schema(description = "the ion's contribution, µS/cm") double conductivityUSPerCm,
      @Schema(description = "share of the channel's conductivity, 0–1") double fraction) {

    static IonShare from(ForwardConductivity.Contribution c, double total) {
      return new IonShare(
          c.ion().name().toLowerCase(Locale.ROOT),
          c.ion().formula(),
          c.ion().chargeNumber(),
          c.molality(),
          c.kappa(),
          c.kappa() / total);
    }
  }
}

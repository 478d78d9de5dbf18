package org.kwanta.service.chemistry;

import io.swagger.v3.oas.annotations.media.Schema;
import java.util.List;
import org.kwanta.model.diagnosis.CoolingWater;
import org.kwanta.model.diagnosis.LeakChannels;

/** The expected rise of each conductivity channel when cooling water enters a water. */
@Schema(description = "Expected channel rises of a cooling-water leak (advisory)")
record IngressResponse(
    @Schema(example = "sea") String coolingWater,
    @Schema(description = "where the cooling water's proportions come from") String source,
    @Schema(example = "5") double sodiumUgPerKg,
    @Schema(example = "25") double temperatureCel,
    @Schema(description = "what the leak adds, mol/kg") Leak leak,
    @Schema(description = "the channels before the leak") ConductivityResponse.Channels before,
    @Schema(description = "the channels with the leak") ConductivityResponse.Channels after,
    @Schema(description = "after − before, µS/cm") Rise rise,
    List<ComponentTotal> composition,
    @Schema(description = "what the calculation assumes") String model) {

  static final String MODEL =
      "The leak brings chloride (with bromide) and sulfate in the cooling water's molar"
          + " proportions to sodium; the other cations that balance them (Mg, Ca, K) are counted as"
          + " sodium equivalents (specific conductivity rise slightly low); bicarbonate is left"
          + " out. The cation channels see the anions as their acids. "
          + ConductivityResponse.MODEL;

  static IngressResponse from(
      CoolingWater kind,
      double sodiumUgPerKg,
      LeakChannels.Rise r,
      List<ComponentTotal> composition) {
    return new IngressResponse(
        ConductivityController.apiName(kind),
        kind.source(),
        sodiumUgPerKg,
        Math.round((r.before().temperatureK() - 273.15) * 1e6) / 1e6,
        new Leak(r.leak().sodium(), r.leak().chloride(), r.leak().sulfate()),
        ConductivityResponse.Channels.from(r.before()),
        ConductivityResponse.Channels.from(r.after()),
        new Rise(r.specific(), r.cation(), r.degassedCation()),
        composition,
        MODEL);
  }

  /** The amounts a leak adds. */
  @Schema(name = "LeakAmounts")
  record Leak(
      @Schema(description = "sodium and the other cations as sodium equivalents, mol/kg")
          double cationEquivalentsMolPerKg,
      double chlorideMolPerKg,
      double sulfateMolPerKg) {}

  /** The rise of each channel. */
  @Schema(name = "ChannelRise")
  record Rise(
      double specificConductivityUSPerCm,
      double cationConductivityUSPerCm,
      double degassedCationConductivityUSPerCm) {}
}

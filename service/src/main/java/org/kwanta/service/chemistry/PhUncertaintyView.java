package org.kwanta.service.chemistry;

import io.swagger.v3.oas.annotations.media.Schema;
import java.util.List;
import org.kwanta.model.aqueous.PhUncertainty;
import org.kwanta.model.aqueous.PhUncertainty.Kind;

/**
 * The uncertainty of a pH at temperature, itemised, as the speciation API and the stored
 * evaluations show it (the same names in both). pH units, molal activity scale.
 */
@Schema(
    name = "PhUncertainty",
    description =
        "pH at temperature's uncertainty in four labelled parts: (a) instrumentTolerances, (b)"
            + " constantSetSpread, (c) estimatedConstants, (d) operatingConditions; low/high"
            + " combine them by the stated rule")
public record PhUncertaintyView(
    @Schema(description = "the central pH", example = "6.12") double ph,
    @Schema(description = "lower end of the combined band", example = "6.02") double low,
    @Schema(description = "upper end of the combined band", example = "6.25") double high,
    @Schema(description = "how the parts are combined into low and high") String rule,
    PartView instrumentTolerances,
    PartView constantSetSpread,
    PartView estimatedConstants,
    PartView operatingConditions) {

  /** The view of a model uncertainty. */
  public static PhUncertaintyView from(PhUncertainty u) {
    return new PhUncertaintyView(
        u.ph(),
        u.low(),
        u.high(),
        PhUncertainty.RULE,
        PartView.from(u.part(Kind.INSTRUMENT_TOLERANCES), u.ph()),
        PartView.from(u.part(Kind.CONSTANT_SET_SPREAD), u.ph()),
        PartView.from(u.part(Kind.ESTIMATED_CONSTANTS), u.ph()),
        PartView.from(u.part(Kind.OPERATING_CONDITIONS), u.ph()));
  }

  /** One part; a part that does not apply has zero width and says why in {@code basis}. */
  @Schema(name = "PhUncertaintyPart")
  public record PartView(
      @Schema(
              description = "which part, with its letter",
              example = "(b) spread over the published constant sets")
          String label,
      @Schema(description = "pH − how far below it this part reaches", example = "6.05") double low,
      @Schema(description = "pH + how far above it this part reaches", example = "6.20")
          double high,
      @Schema(description = "how far below the pH, pH units (≥ 0)", example = "0.07")
          double belowPh,
      @Schema(description = "how far above the pH, pH units (≥ 0)", example = "0.08")
          double abovePh,
      @Schema(description = "(b) only: the set giving the lowest pH", example = "ammonium-3")
          String lowConstantSet,
      @Schema(description = "(b) only: the set giving the highest pH", example = "ammonium-2")
          String highConstantSet,
      @Schema(description = "how the part was computed, or why it does not apply") String basis,
      List<ContributionView> contributions) {

    static PartView from(PhUncertainty.Part p, double ph) {
      return new PartView(
          p.kind().label(),
          ph - p.below(),
          ph + p.above(),
          p.below(),
          p.above(),
          p.lowConstantSet().isEmpty() ? null : p.lowConstantSet(),
          p.highConstantSet().isEmpty() ? null : p.highConstantSet(),
          p.basis(),
          p.contributions().stream()
              .map(c -> new ContributionView(c.source(), c.halfWidthPh(), c.detail()))
              .toList());
    }
  }

  /** What makes up a part: one tolerance or one constant. */
  @Schema(name = "PhUncertaintyContribution")
  public record ContributionView(
      @Schema(example = "cyclohexylammonium") String source,
      @Schema(description = "± pH units", example = "0.17") double halfWidthPh,
      @Schema(
              example =
                  "fit cyclohexylammonium-1, log10 K -5.778 ± 0.400: estimate (CHA estimate):"
                      + " growing with the distance from 25 °C, where its only data are;"
                      + " dpH/dlog10 K -0.42")
          String detail) {}
}

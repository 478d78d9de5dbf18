package org.kwanta.service.chemistry;

import com.fasterxml.jackson.annotation.JsonInclude;
import io.swagger.v3.oas.annotations.media.Schema;
import java.util.List;
import org.kwanta.model.aqueous.PhUncertainty;
import org.kwanta.model.aqueous.PhUncertainty.Kind;

/**
 * The uncertainty of a pH at temperature, itemised, as the speciation API and the stored
 * evaluations show it (the same names in both). pH units, molal activity scale.
 *
 * <p>A stored evaluation keeps it compact ({@link #compact()}, read back through {@link
 * #filled()}): per part the half-widths (to 1e-6 pH), the constant sets and each contribution's
 * source and half-width; the labels, the rule and each part's low/high are filled in again when
 * read, and the texts saying how each part was computed ({@code basis}, a contribution's {@code
 * detail}) are not stored (they tripled the stored evaluation and halved the ingest rate): {@code
 * basis} then reads {@link #STORED_BASIS}.
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
    @Schema(description = "how the parts are combined into low and high")
        @JsonInclude(JsonInclude.Include.NON_NULL)
        String rule,
    PartView instrumentTolerances,
    PartView constantSetSpread,
    PartView estimatedConstants,
    PartView operatingConditions) {

  /** A stored part's basis, read back (the text is not stored with the evaluation). */
  public static final String STORED_BASIS =
      "not stored with the evaluation; how this part is computed: docs/speciation.md, and the"
          + " speciation API gives it in full for the same water";

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

  /**
   * The stored form read back: labels, rule and each part's low/high filled in again, and the
   * untold basis said to be untold (a full view is returned as it is).
   */
  public PhUncertaintyView filled() {
    return new PhUncertaintyView(
        ph,
        low,
        high,
        rule == null ? PhUncertainty.RULE : rule,
        filled(instrumentTolerances, Kind.INSTRUMENT_TOLERANCES, ph),
        filled(constantSetSpread, Kind.CONSTANT_SET_SPREAD, ph),
        filled(estimatedConstants, Kind.ESTIMATED_CONSTANTS, ph),
        filled(operatingConditions, Kind.OPERATING_CONDITIONS, ph));
  }

  private static PartView filled(PartView p, Kind kind, double ph) {
    if (p == null || p.label() != null) {
      return p;
    }
    return new PartView(
        kind.label(),
        ph - p.belowPh(),
        ph + p.abovePh(),
        p.belowPh(),
        p.abovePh(),
        p.lowConstantSet(),
        p.highConstantSet(),
        p.basis() == null ? STORED_BASIS : p.basis(),
        p.contributions());
  }

  /**
   * The form stored with an evaluation: no labels, rule, texts or per-part low/high ({@link
   * #filled()} puts them back), half-widths rounded to 1e-6 pH.
   */
  public PhUncertaintyView compact() {
    return new PhUncertaintyView(
        ph,
        low,
        high,
        null,
        compact(instrumentTolerances),
        compact(constantSetSpread),
        compact(estimatedConstants),
        compact(operatingConditions));
  }

  private static PartView compact(PartView p) {
    return p == null ? null : p.compact();
  }

  /** One part; a part that does not apply has zero width and says why in {@code basis}. */
  @Schema(name = "PhUncertaintyPart")
  public record PartView(
      @Schema(
              description = "which part, with its letter",
              example = "(b) spread over the published constant sets")
          @JsonInclude(JsonInclude.Include.NON_NULL)
          String label,
      @Schema(description = "pH − how far below it this part reaches", example = "6.05")
          @JsonInclude(JsonInclude.Include.NON_NULL)
          Double low,
      @Schema(description = "pH + how far above it this part reaches", example = "6.20")
          @JsonInclude(JsonInclude.Include.NON_NULL)
          Double high,
      @Schema(description = "how far below the pH, pH units (≥ 0)", example = "0.07")
          double belowPh,
      @Schema(description = "how far above the pH, pH units (≥ 0)", example = "0.08")
          double abovePh,
      @Schema(description = "(b) only: the set giving the lowest pH", example = "ammonium-3")
          String lowConstantSet,
      @Schema(description = "(b) only: the set giving the highest pH", example = "ammonium-2")
          String highConstantSet,
      @Schema(description = "how the part was computed, or why it does not apply")
          @JsonInclude(JsonInclude.Include.NON_NULL)
          String basis,
      List<ContributionView> contributions) {

    PartView compact() {
      return new PartView(
          null,
          null,
          null,
          round(belowPh),
          round(abovePh),
          lowConstantSet,
          highConstantSet,
          null,
          contributions == null
              ? List.of()
              : contributions.stream()
                  .map(c -> new ContributionView(c.source(), round(c.halfWidthPh()), null))
                  .toList());
    }

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
          @JsonInclude(JsonInclude.Include.NON_NULL)
          String detail) {}

  /** To 1e-6 pH (far below any part's meaning), so the stored numbers are short. */
  static double round(double x) {
    return Math.rint(x * 1e6) / 1e6;
  }
}

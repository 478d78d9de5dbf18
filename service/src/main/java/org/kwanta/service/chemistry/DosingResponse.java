package org.kwanta.service.chemistry;

import io.swagger.v3.oas.annotations.media.Schema;
import java.util.List;
import java.util.Map;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.aqueous.Dosing;

/** The advised dose with its band over the published constant sets (advisory). */
@Schema(description = "Dosing advice (advisory: the plant's procedures govern)")
record DosingResponse(
    @Schema(allowableValues = {"ph25", "margin_over_neutral"}) String basis,
    @Schema(example = "9.6") double target,
    @Schema(description = "the dose with the default constants") Dose dose,
    @Schema(description = "the smallest dose over the constant sets") Dose lowest,
    @Schema(description = "the largest dose over the constant sets") Dose highest,
    @Schema(description = "the water already meets the target: no dose") boolean alreadyAtTarget,
    String caution) {

  static final String CAUTION =
      "Advisory: a calculated dose rests on the composition given, published equilibrium"
          + " constants (the band shows their spread) and the activity model; it does not replace"
          + " measurement. Change dosing only as the plant's procedures and qualified chemists"
          + " direct.";

  static DosingResponse from(Dosing.Basis basis, double target, Dosing.Advice a) {
    return new DosingResponse(
        basis == Dosing.Basis.PH_25 ? "ph25" : "margin_over_neutral",
        target,
        Dose.from(a.dose()),
        Dose.from(a.lowest()),
        Dose.from(a.highest()),
        a.alreadyAtTarget(),
        CAUTION);
  }

  /** One dose. */
  @Schema(name = "AlkalizerDose")
  record Dose(
      @Schema(description = "all alkalizers, mg/kg", example = "1.9") double totalMgPerKg,
      List<Part> alkalizers,
      @Schema(example = "9.6") double phAt25Cel,
      @Schema(description = "pH at the location (null for a 25 °C target)") Double phAtTemperature,
      @Schema(description = "neutral pH at the location (null for a 25 °C target)")
          Double neutralPh,
      @Schema(example = "default") String constantSet) {

    static Dose from(Dosing.Dose d) {
      double total = 0;
      List<Part> parts = new java.util.ArrayList<>();
      for (Map.Entry<Component, Double> e : d.totals().entrySet()) {
        double mg = e.getValue() * e.getKey().molarMassGPerMol() * 1000;
        total += mg;
        parts.add(new Part(SpeciationInputs.apiName(e.getKey()), mg, e.getValue()));
      }
      return new Dose(
          total,
          List.copyOf(parts),
          d.ph25(),
          Double.isNaN(d.phAtLocation()) ? null : d.phAtLocation(),
          Double.isNaN(d.neutralPhAtLocation()) ? null : d.neutralPhAtLocation(),
          d.constantSet());
    }
  }

  /** One alkalizer's part of a dose. */
  @Schema(name = "AlkalizerDosePart")
  record Part(
      @Schema(example = "ammonia") String component, double mgPerKg, double molalityMolPerKg) {}
}

package org.kwanta.service.chemistry;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.kwanta.model.OutOfValidityRangeException;
import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;
import org.kwanta.model.aqueous.ActivityModel;
import org.kwanta.model.aqueous.AmountUnit;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.aqueous.Composition;
import org.kwanta.model.aqueous.ConstantSet;
import org.kwanta.model.aqueous.ConstantSets;
import org.kwanta.model.aqueous.SampleOrigin;
import org.kwanta.model.aqueous.Speciation;
import org.kwanta.model.aqueous.SpeciationOptions;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Phase;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.system.ProblemTypes;
import org.kwanta.service.water.IonizationNames;
import org.springframework.http.HttpStatus;

/**
 * Turns the names and numbers of a request into model inputs: 400 for a name or unit the service
 * does not know, the model's own {@link OutOfValidityRangeException} (422) for a value outside a
 * validity range. No unit conversion happens here: amounts go through {@link AmountUnit}.
 */
final class SpeciationInputs {

  /**
   * The liquid region at a given temperature: pressure from the IF97 saturation pressure up to the
   * 100 MPa limit of region 1. A given pressure below saturation would be steam.
   */
  static final Reference LIQUID_REGION =
      new Reference(
          "IAPWS-IF97 region 1",
          "IAPWS R7-97(2012), IAPWS-IF97: region 1 (liquid) lies between the region-4 saturation"
              + " pressure and 100 MPa; the speciation engine treats liquid water only",
          Reference.Confidence.VERIFIED_BY_CHECK_TABLE);

  private SpeciationInputs() {}

  /** The parts of a request shared by the single and the curve calculation. */
  record Choices(
      List<AmountInput> composition,
      Double pressureMPa,
      String activityModel,
      String constantSet,
      String sampleOrigin,
      String ionization,
      Boolean ionAssociation) {}

  /** Parsed inputs, ready for the engine. */
  record Parsed(
      Composition composition,
      List<ComponentTotal> totals,
      SpeciationOptions options,
      IonizationFormulation ionization,
      Double pressureMPa) {

    /**
     * Liquid water at a temperature, at the given pressure or, without one, at saturation.
     *
     * @throws OutOfValidityRangeException outside 0-350 °C, or a given pressure at which the water
     *     would be steam
     */
    WaterState water(double temperatureCel) {
      if (!Double.isFinite(temperatureCel)) {
        throw ProblemException.of("temperature must be a finite number");
      }
      double k = Speciation.TEMPERATURE_RANGE.check(temperatureCel + 273.15);
      if (pressureMPa == null) {
        return Water.atSaturation(k, ionization);
      }
      WaterState w = Water.at(k, pressureMPa * 1e6, ionization);
      if (w.phase() != Phase.LIQUID_REGION_1) {
        throw new OutOfValidityRangeException(
            new ValidityRange(
                "pressure at " + temperatureCel + " Cel",
                w.saturationPressurePa() / 1e6,
                Water.PRESSURE_VALIDITY.max() / 1e6,
                "MPa",
                LIQUID_REGION),
            pressureMPa);
      }
      return w;
    }
  }

  static Parsed parse(Choices c, IonizationFormulation defaultIonization) {
    if (c.composition() == null) {
      throw ProblemException.of(
          "composition is required: a list of {component, amount, unit} (empty for pure water)");
    }
    Composition.Builder builder = Composition.builder();
    List<ComponentTotal> totals = new ArrayList<>();
    Set<Component> seen = EnumSet.noneOf(Component.class);
    for (int i = 0; i < c.composition().size(); i++) {
      AmountInput a = c.composition().get(i);
      if (a == null) {
        throw ProblemException.of("composition[" + i + "] is null");
      }
      Component component = component(a.component(), i);
      AmountUnit unit = unit(a.unit(), i);
      if (a.amount() == null) {
        throw ProblemException.of("composition[" + i + "].amount is required");
      }
      if (!seen.add(component)) {
        throw ProblemException.of(
            "composition[" + i + "]: " + apiName(component) + " is listed twice");
      }
      double molal = unit.toMolPerKg(component, a.amount());
      // Checked here as well as in the model so that the 422 names the component.
      ValidityRange r = Composition.TOTAL_MOLALITY_RANGE;
      new ValidityRange(
              r.quantity() + " of " + apiName(component), r.min(), r.max(), r.unit(), r.source())
          .check(molal);
      builder.molal(component, molal);
      totals.add(ComponentTotal.of(component, a.amount(), unit, molal));
    }
    if (c.pressureMPa() != null && !Double.isFinite(c.pressureMPa())) {
      throw ProblemException.of("pressureMPa must be a finite number");
    }
    SpeciationOptions options =
        new SpeciationOptions(
            constantSet(c.constantSet()),
            activityModel(c.activityModel()),
            sampleOrigin(c.sampleOrigin()),
            c.ionAssociation() == null || c.ionAssociation()
                ? SpeciationOptions.DEFAULT_ASSOCIATIONS
                : java.util.Set.of());
    return new Parsed(
        builder.build(),
        List.copyOf(totals),
        options,
        IonizationNames.parse(c.ionization(), defaultIonization),
        c.pressureMPa());
  }

  /** The API name of a component: the enum name in lower case ({@code carbon_dioxide}). */
  static String apiName(Component c) {
    return c.name().toLowerCase(Locale.ROOT);
  }

  static String apiName(ActivityModel m) {
    return switch (m) {
      case DAVIES -> "davies";
      case B_DOT -> "bdot";
    };
  }

  static String apiName(SampleOrigin o) {
    return o.name().toLowerCase(Locale.ROOT);
  }

  private static String normalise(String s) {
    return s.trim().toLowerCase(Locale.ROOT).replace('-', '_').replace(' ', '_');
  }

  private static Component component(String name, int index) {
    if (name != null) {
      String n = normalise(name);
      for (Component c : Component.values()) {
        if (apiName(c).equals(n)) {
          return c;
        }
      }
    }
    List<String> known = Arrays.stream(Component.values()).map(SpeciationInputs::apiName).toList();
    Map<String, Object> props = new LinkedHashMap<>();
    props.put("field", "composition[" + index + "].component");
    props.put("knownComponents", known);
    throw new ProblemException(
        HttpStatus.BAD_REQUEST,
        ProblemTypes.BAD_REQUEST,
        "Unknown component",
        "composition["
            + index
            + "]: unknown component '"
            + name
            + "'; known components: "
            + String.join(", ", known),
        props);
  }

  private static AmountUnit unit(String code, int index) {
    return AmountUnit.fromUcum(code == null ? null : code.trim())
        .orElseThrow(
            () -> {
              List<String> known =
                  Arrays.stream(AmountUnit.values()).map(AmountUnit::ucum).toList();
              return new ProblemException(
                  HttpStatus.BAD_REQUEST,
                  ProblemTypes.BAD_REQUEST,
                  "Unknown unit",
                  "composition["
                      + index
                      + "]: unit '"
                      + code
                      + "' is not accepted; use a UCUM code: "
                      + String.join(", ", known),
                  Map.of("field", "composition[" + index + "].unit", "knownUnits", known));
            });
  }

  private static ActivityModel activityModel(String name) {
    if (name == null || name.isBlank()) {
      return ActivityModel.DAVIES;
    }
    return switch (normalise(name)) {
      case "davies" -> ActivityModel.DAVIES;
      case "bdot", "b_dot" -> ActivityModel.B_DOT;
      default ->
          throw ProblemException.of("activityModel must be davies or bdot, not '" + name + "'");
    };
  }

  private static SampleOrigin sampleOrigin(String name) {
    if (name == null || name.isBlank()) {
      return SampleOrigin.LIQUID;
    }
    return switch (normalise(name)) {
      case "liquid" -> SampleOrigin.LIQUID;
      case "condensed_steam" -> SampleOrigin.CONDENSED_STEAM;
      default ->
          throw ProblemException.of(
              "sampleOrigin must be liquid or condensed_steam, not '" + name + "'");
    };
  }

  private static ConstantSet constantSet(String name) {
    if (name == null || name.isBlank()) {
      return ConstantSets.DEFAULT;
    }
    for (ConstantSet s : ConstantSets.all()) {
      if (s.id().equalsIgnoreCase(name.trim())) {
        return s;
      }
    }
    List<String> known = ConstantSets.all().stream().map(ConstantSet::id).toList();
    throw new ProblemException(
        HttpStatus.BAD_REQUEST,
        ProblemTypes.BAD_REQUEST,
        "Unknown constant set",
        "no constant set with id '" + name + "'; known sets: " + String.join(", ", known),
        Map.of("field", "constantSet", "knownConstantSets", known));
  }
}

package org.kwanta.model.aqueous;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.Arrays;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.kwanta.model.conductivity.AlkalizerMix;

/**
 * The one description of a solute ({@link Component}, {@link Species}, {@link Equilibrium}) and its
 * notation: formula without charge plus charge number, symbols and reactions in chemical
 * typography, ids of our own for fits and constant sets.
 */
class SoluteDescriptionTest {

  @Test
  void speciesCarryFormulaWithoutChargeAndAChargeNumber() {
    assertThat(Species.SULFATE.formula()).isEqualTo("SO4");
    assertThat(Species.SULFATE.chargeNumber()).isEqualTo(-2);
    assertThat(Species.SULFATE.symbol()).isEqualTo("SO₄²⁻");
    assertThat(Species.AMMONIUM.symbol()).isEqualTo("NH₄⁺");
    assertThat(Species.PHOSPHATE.symbol()).isEqualTo("PO₄³⁻");
    assertThat(Species.DIMETHYLAMMONIUM.symbol()).isEqualTo("(CH₃)₂NH₂⁺");
    assertThat(Species.CARBON_DIOXIDE.symbol()).isEqualTo("CO₂");
    for (Species s : Species.values()) {
      assertThat(s.formula()).as("%s", s).doesNotContain("+", "-");
    }
  }

  @Test
  void reactionsAreWrittenInChemicalTypography() {
    assertThat(Equilibrium.BISULFATE.reaction()).isEqualTo("HSO₄⁻ ⇌ SO₄²⁻ + H⁺");
    assertThat(Equilibrium.CARBONIC_FIRST.reaction()).isEqualTo("CO₂ + H₂O ⇌ HCO₃⁻ + H⁺");
    assertThat(Equilibrium.AMMONIUM.reaction()).isEqualTo("NH₄⁺ ⇌ NH₃ + H⁺");
  }

  /**
   * The equilibria keep the names and order they had as an enum (the API shows the names, the
   * engine indexes arrays by the order): first the weak bases' steps, in component order, each
   * following from its two species and named as its acid, then the acids' declared steps.
   */
  @Test
  void equilibriaFollowTheSpeciesChains() {
    List<String> names = Arrays.stream(Equilibrium.values()).map(Equilibrium::name).toList();
    List<String> weakBases =
        AlkalizerMix.alkalizers().stream().map(c -> c.species().get(0).name()).toList();
    assertThat(weakBases)
        .startsWith(
            "AMMONIUM",
            "MORPHOLINIUM",
            "ETHANOLAMMONIUM",
            "CYCLOHEXYLAMMONIUM",
            "DIMETHYLAMMONIUM",
            "METHOXYPROPYLAMMONIUM",
            "DIETHYLAMINOETHANOLIUM");
    assertThat(names.subList(0, weakBases.size())).isEqualTo(weakBases);
    assertThat(names.subList(weakBases.size(), names.size()))
        .containsExactly(
            "BISULFATE",
            "CARBONIC_FIRST",
            "CARBONIC_SECOND",
            "PHOSPHORIC_FIRST",
            "PHOSPHORIC_SECOND",
            "PHOSPHORIC_THIRD",
            "ACETIC",
            "FORMIC",
            "BORIC");
    Equilibrium[] all = Equilibrium.values();
    for (int i = 0; i < all.length; i++) {
      assertThat(all[i].ordinal()).isEqualTo(i);
    }
    for (Component c : AlkalizerMix.alkalizers()) {
      Equilibrium e = Equilibrium.ofWeakBase(c);
      assertThat(c.equilibria()).containsExactly(e);
      assertThat(e.acid()).isEqualTo(c.species().get(0));
      assertThat(e.base()).isEqualTo(c.species().get(1));
      assertThat(e.name()).isEqualTo(e.acid().name());
      assertThat(e.component()).isEqualTo(c);
    }
    assertThat(Equilibrium.ofWeakBase(Component.AMMONIA)).isSameAs(Equilibrium.AMMONIUM);
    assertThat(Equilibrium.ofWeakBase(Component.MORPHOLINE).reaction())
        .isEqualTo("C₄H₉NOH⁺ ⇌ C₄H₉NO + H⁺");
    assertThatThrownBy(() -> Equilibrium.ofWeakBase(Component.SULFATE))
        .isInstanceOf(IllegalArgumentException.class);
    assertThat(Component.PHOSPHATE.equilibria())
        .containsExactly(
            Equilibrium.PHOSPHORIC_FIRST,
            Equilibrium.PHOSPHORIC_SECOND,
            Equilibrium.PHOSPHORIC_THIRD);
    assertThat(Component.SODIUM.equilibria()).isEmpty();
  }

  @Test
  void everyChargedSpeciesOfAConductivityFitHasALimitingConductivity() {
    for (Species s : Species.values()) {
      if (s.chargeNumber() == 0) {
        assertThat(s.lambda25()).as("%s", s).isZero();
      } else if (s != Species.BISULFATE && s != Species.BORATE && !s.isAssociated()) {
        // charged ion pairs and polyborates are speciation-only (no λ° carried, NaN)
        assertThat(s.lambda25()).as("%s", s).isPositive();
        assertThat(s.lambdaSource()).as("%s", s).isPresent();
      }
    }
  }

  @Test
  void waterIonsBelongToNoComponent() {
    assertThat(Species.HYDROGEN_ION.isWaterIon()).isTrue();
    assertThatThrownBy(Species.HYDROXIDE::component).isInstanceOf(IllegalStateException.class);
    assertThat(Species.AMMONIUM.component()).isEqualTo(Component.AMMONIA);
  }

  /** The alkalizers are exactly the weak-base components, and only they make a mix. */
  @Test
  void alkalizersAreTheWeakBases() {
    assertThat(AlkalizerMix.alkalizers())
        .containsExactly(
            Component.AMMONIA,
            Component.MORPHOLINE,
            Component.ETHANOLAMINE,
            Component.CYCLOHEXYLAMINE,
            Component.DIMETHYLAMINE,
            Component.METHOXYPROPYLAMINE,
            Component.DIETHYLAMINOETHANOL);
    assertThatThrownBy(() -> AlkalizerMix.of(Component.SODIUM))
        .isInstanceOf(IllegalArgumentException.class);
    // IUPAC conventional atomic weights: C 12.011, H 1.008, N 14.007, O 15.999 (from memory)
    assertThat(Component.MORPHOLINE.molarMassGPerMol())
        .isCloseTo(87.122, org.assertj.core.api.Assertions.within(0.0005));
    AlkalizerMix mix =
        AlkalizerMix.byMass(Map.of(Component.AMMONIA, 1.0, Component.MORPHOLINE, 1.0));
    assertThat(mix.molarFractions().get(Component.AMMONIA))
        .isCloseTo(87.122 / (87.122 + 17.031), org.assertj.core.api.Assertions.within(1e-9));
  }

  /** Ids are our own: no database file names of other tools, no charge notation. */
  @Test
  void fitAndConstantSetIdsAreOurOwn() {
    for (Fit f : EquilibriumConstants.all()) {
      assertThat(f.id()).as(f.id()).matches("[a-z]+(-[a-z]+)*-[0-9]+");
    }
    for (ConstantSet s : ConstantSets.all()) {
      assertThat(s.id()).as(s.id()).matches("[a-z]+(-[a-z0-9]+)*");
      assertThat(ConstantSets.byId(s.id())).isSameAs(s);
    }
  }
}

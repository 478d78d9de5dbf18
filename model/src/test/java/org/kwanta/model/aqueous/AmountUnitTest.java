package org.kwanta.model.aqueous;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * UCUM codes and conversions of {@link AmountUnit}. Mass units go through {@link Amounts} (tested
 * there); molal prefixes are the SI definitions (milli = 1e-3, micro = 1e-6).
 */
class AmountUnitTest {

  @Test
  void ucumCodesAreExactAndCaseSensitive() {
    assertThat(AmountUnit.fromUcum("mg/kg")).contains(AmountUnit.MILLIGRAMS_PER_KILOGRAM);
    assertThat(AmountUnit.fromUcum("ug/kg")).contains(AmountUnit.MICROGRAMS_PER_KILOGRAM);
    assertThat(AmountUnit.fromUcum("mol/kg")).contains(AmountUnit.MOLES_PER_KILOGRAM);
    assertThat(AmountUnit.fromUcum("mmol/kg")).contains(AmountUnit.MILLIMOLES_PER_KILOGRAM);
    assertThat(AmountUnit.fromUcum("umol/kg")).contains(AmountUnit.MICROMOLES_PER_KILOGRAM);
    assertThat(AmountUnit.fromUcum("MG/KG")).isEmpty();
    assertThat(AmountUnit.fromUcum("ppm")).isEmpty();
    assertThat(AmountUnit.fromUcum(null)).isEmpty();
  }

  @Test
  void massUnitsUseAmounts() {
    assertThat(AmountUnit.MILLIGRAMS_PER_KILOGRAM.toMolPerKg(Component.AMMONIA, 1.0))
        .isEqualTo(Amounts.molalFromMilligramsPerKilogram(Component.AMMONIA, 1.0));
    assertThat(AmountUnit.MICROGRAMS_PER_KILOGRAM.toMolPerKg(Component.CHLORIDE, 5.0))
        .isEqualTo(Amounts.molalFromMicrogramsPerKilogram(Component.CHLORIDE, 5.0));
  }

  @Test
  void molalPrefixesAreSiDefinitions() {
    assertThat(AmountUnit.MILLIMOLES_PER_KILOGRAM.toMolPerKg(Component.SODIUM, 2.5))
        .isEqualTo(0.0025);
    assertThat(AmountUnit.MICROMOLES_PER_KILOGRAM.toMolPerKg(Component.SODIUM, 7.0))
        .isEqualTo(7e-6);
    assertThat(AmountUnit.MOLES_PER_KILOGRAM.toMolPerKg(Component.SODIUM, 0.01)).isEqualTo(0.01);
  }

  @ParameterizedTest
  @EnumSource(AmountUnit.class)
  void roundTripsWithinFourUlp(AmountUnit unit) {
    Random rnd = new Random(20260601L + unit.ordinal());
    for (int i = 0; i < 200; i++) {
      Component c = Component.values()[rnd.nextInt(Component.values().length)];
      double v = Math.pow(10, -6 + 8 * rnd.nextDouble());
      double back = unit.fromMolPerKg(c, unit.toMolPerKg(c, v));
      assertThat(back).isCloseTo(v, within(4 * Math.ulp(v)));
    }
  }
}

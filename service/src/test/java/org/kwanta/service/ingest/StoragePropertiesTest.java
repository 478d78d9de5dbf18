package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.Duration;
import org.junit.jupiter.api.Test;
import org.kwanta.service.ingest.StorageMaintenance.StorageProperties;

/** The storage settings' defaults and the packing horizon's lower limit. */
class StoragePropertiesTest {

  @Test
  void packingIsOnAndPacksAfterTwoDaysByDefault() {
    StorageProperties p = new StorageProperties(0, 0, null, null, null);
    assertThat(p.packing()).isTrue();
    assertThat(p.packAfter()).isEqualTo(Duration.ofDays(2));
  }

  @Test
  void refusesAPackingHorizonUnderOneDay() {
    assertThatThrownBy(() -> new StorageProperties(7, 0, true, true, Duration.ofHours(23)))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("PT23H")
        .hasMessageContaining("PT24H");
    assertThat(new StorageProperties(7, 0, true, true, Duration.ofDays(1)).packAfter())
        .isEqualTo(Duration.ofDays(1));
  }
}

package org.kwanta.service.operatingstate;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.kwanta.model.limits.TimeWindow;

/** The timeline of recorded states: corrections, unrecorded time and the in-service windows. */
class TimelineTest {

  private static final Instant T0 = Instant.parse("2026-04-01T00:00:00Z");

  private static OperatingStates.Entry entry(long id, OperatingState s, int hour) {
    return new OperatingStates.Entry(
        id, "p", "U1", s, T0.plus(Duration.ofHours(hour)), null, T0, "k", "key");
  }

  @Test
  void unrecordedTimeAndInServiceCountAndALaterEntryCorrectsAnEarlierOne() {
    List<OperatingStates.Entry> entries =
        List.of(
            entry(1, OperatingState.SHUT_DOWN, 10),
            entry(2, OperatingState.START_UP, 10), // correction: same since, entered later
            entry(3, OperatingState.IN_SERVICE, 14),
            entry(4, OperatingState.IN_SERVICE, 16)); // repeats the state: no new span
    ServiceTime t = OperatingStates.timeline(entries, T0, T0.plus(Duration.ofHours(24)));
    assertThat(t.spans())
        .extracting(s -> s.state() + " " + Duration.between(s.start(), s.end()).toHours())
        .containsExactly("null 10", "START_UP 4", "IN_SERVICE 10");
    assertThat(t.unrecorded()).isEqualTo(Duration.ofHours(10));
    assertThat(t.byState()).doesNotContainKey(OperatingState.SHUT_DOWN);
    assertThat(t.counted())
        .containsExactly(
            new TimeWindow(T0, T0.plus(Duration.ofHours(10))),
            new TimeWindow(T0.plus(Duration.ofHours(14)), T0.plus(Duration.ofHours(24))));
    assertThat(t.inService()).isEqualTo(Duration.ofHours(20));
    assertThat(t.inService(T0.plus(Duration.ofHours(12)))).isFalse();
  }

  @Test
  void aStateRecordedBeforeThePeriodHoldsAtItsStart() {
    ServiceTime t =
        OperatingStates.timeline(
            List.of(entry(1, OperatingState.LAYUP_DRY, -48)), T0, T0.plus(Duration.ofHours(5)));
    assertThat(t.spans())
        .singleElement()
        .extracting(ServiceTime.Span::state)
        .isEqualTo(OperatingState.LAYUP_DRY);
    assertThat(t.counted()).isEmpty();
  }

  private static org.kwanta.service.ingest.ReadingHistory.PointReading historian(
      double code, int hour) {
    return new org.kwanta.service.ingest.ReadingHistory.PointReading(
        "U1-DRUM", "operating_state", T0.plus(Duration.ofHours(hour)), code);
  }

  @Test
  void historianStatesMergeWithTheChemistsAndTheChemistWinsAtTheSameInstant() {
    List<OperatingStates.Entry> entries =
        List.of(entry(1, OperatingState.START_UP, 6), entry(2, OperatingState.IN_SERVICE, 12));
    List<org.kwanta.service.ingest.ReadingHistory.PointReading> readings =
        List.of(
            historian(3, -2), // shut down before the period: in force at its start
            historian(1, 6), // same instant as the chemist's START_UP: the chemist wins
            historian(2, 8), // still starting up: the span goes on, started by the chemist
            historian(1, 10), // the historian reports in service first
            historian(2.5, 11)); // not a code: skipped
    ServiceTime t = OperatingStates.timeline(entries, readings, T0, T0.plus(Duration.ofHours(24)));
    assertThat(t.spans())
        .extracting(
            s ->
                s.state() + " " + Duration.between(s.start(), s.end()).toHours() + " " + s.source())
        .containsExactly("SHUT_DOWN 6 HISTORIAN", "START_UP 4 CHEMIST", "IN_SERVICE 14 HISTORIAN");
    assertThat(t.inService()).isEqualTo(Duration.ofHours(14));
    assertThat(t.unrecorded()).isZero();
  }
}

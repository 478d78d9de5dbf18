package org.kwanta.service.system;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicReference;
import org.junit.jupiter.api.Test;
import org.springframework.boot.jdbc.autoconfigure.DataSourceProperties;
import org.springframework.dao.DataAccessResourceFailureException;
import org.springframework.jdbc.datasource.DriverManagerDataSource;

/** The routing decision of {@link ReadSource}, with an injected lag and no database. */
class ReadSourceTest {

  private static final String REFUSING = "jdbc:postgresql://127.0.0.1:1,127.0.0.1:2/kwanta";

  private final AtomicReference<Instant> now =
      new AtomicReference<>(Instant.parse("2026-12-03T00:00:00Z"));
  private final Clock clock =
      new Clock() {
        @Override
        public ZoneOffset getZone() {
          return ZoneOffset.UTC;
        }

        @Override
        public Clock withZone(java.time.ZoneId zone) {
          return this;
        }

        @Override
        public Instant instant() {
          return now.get();
        }
      };

  private ReadSource source(String url, ReplicaLag lag) {
    ReplicaProperties p =
        new ReplicaProperties(
            url, "u", "p", Duration.ofSeconds(5), Duration.ofSeconds(1), Duration.ofSeconds(1));
    return new ReadSource(
        new DriverManagerDataSource("jdbc:postgresql://127.0.0.1:1/primary"),
        new DataSourceProperties(),
        p,
        lag,
        clock);
  }

  @Test
  void withoutAReplicaEverythingReadsThePrimary() {
    ReadSource reads = source("", replica -> Duration.ZERO);
    assertThat(reads.decide().reason()).isEqualTo(ReadSource.Reason.NO_REPLICA);
    assertThat(reads.replicaUrl()).isEmpty();
    reads.destroy();
  }

  @Test
  void passesTheMultiHostUrlToThePoolUnchanged() {
    String url = REFUSING + "?targetServerType=primary&hostRecheckSeconds=2";
    ReadSource reads = source(url, replica -> Duration.ZERO);
    assertThat(reads.replicaUrl()).contains(url);
    reads.destroy();
  }

  @Test
  void readsTheReplicaWithinTheMaximumLagAndThePrimaryOverIt() {
    AtomicReference<Duration> lag = new AtomicReference<>(Duration.ofMillis(4999));
    ReadSource reads = source(REFUSING, replica -> lag.get());
    ReadSource.Decision within = reads.decide();
    assertThat(within.replica()).isTrue();
    assertThat(within.lag()).contains(Duration.ofMillis(4999));

    lag.set(Duration.ofMillis(5001));
    now.set(now.get().plusSeconds(1));
    ReadSource.Decision over = reads.decide();
    assertThat(over.replica()).isFalse();
    assertThat(over.reason()).isEqualTo(ReadSource.Reason.LAG);
    assertThat(over.lag()).contains(Duration.ofMillis(5001));
    reads.destroy();
  }

  @Test
  void aReplicaThatDoesNotAnswerSendsReadsToThePrimary() {
    ReadSource reads =
        source(
            REFUSING,
            replica -> {
              throw new DataAccessResourceFailureException("connection refused");
            });
    ReadSource.Decision d = reads.decide();
    assertThat(d.replica()).isFalse();
    assertThat(d.reason()).isEqualTo(ReadSource.Reason.UNREACHABLE);
    assertThat(d.lag()).isEmpty();
    reads.destroy();
  }

  @Test
  void measuresAtMostOncePerRefresh() {
    AtomicInteger measured = new AtomicInteger();
    ReadSource reads =
        source(
            REFUSING,
            replica -> {
              measured.incrementAndGet();
              return Duration.ZERO;
            });
    reads.decide();
    now.set(now.get().plusMillis(999));
    reads.decide();
    assertThat(measured).hasValue(1);
    now.set(now.get().plusMillis(1));
    reads.decide();
    assertThat(measured).hasValue(2);
    reads.destroy();
  }

  @Test
  void outsideAReadScopeTheTemplateIsThePrimarys() {
    DriverManagerDataSource primary =
        new DriverManagerDataSource("jdbc:postgresql://127.0.0.1:1/p");
    ReadSource reads =
        new ReadSource(
            primary,
            new DataSourceProperties(),
            new ReplicaProperties(
                REFUSING, "", "", Duration.ofSeconds(5), Duration.ZERO, Duration.ofSeconds(1)),
            replica -> Duration.ZERO,
            clock);
    assertThat(reads.jdbc().getDataSource()).isSameAs(primary);
    ReadSource.Decision d = reads.decide();
    assertThat(reads.onReplica(d, () -> reads.jdbc().getDataSource())).isNotSameAs(primary);
    assertThat(reads.jdbc().getDataSource()).isSameAs(primary);
    reads.destroy();
  }
}

package org.kwanta.service.system;

import io.micrometer.core.instrument.Counter;
import io.micrometer.core.instrument.Gauge;
import io.micrometer.core.instrument.MeterRegistry;
import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.time.Duration;
import java.util.concurrent.Semaphore;
import org.kwanta.service.metrics.MetricNames;
import org.springframework.http.HttpStatus;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * Bounds the ingest requests in progress to {@code kwanta.limits.max-concurrent-ingests}. One more
 * is not queued: it is answered at once with 503 and Retry-After, so a burst from many historians
 * cannot pile up threads and database connections. Metrics: {@code kwanta_ingest_in_flight} and
 * {@code kwanta_ingest_rejected_busy_total}.
 */
final class IngestConcurrencyFilter extends OncePerRequestFilter {

  private final Semaphore permits;
  private final Duration retryAfter;
  private final ProblemResponses problems;
  private final Counter rejected;

  IngestConcurrencyFilter(
      LimitsProperties limits, ProblemResponses problems, MeterRegistry meters) {
    int max = limits.maxConcurrentIngests();
    this.permits = new Semaphore(max);
    this.retryAfter = limits.retryAfter();
    this.problems = problems;
    Gauge.builder(MetricNames.INGEST_IN_FLIGHT, permits, p -> max - p.availablePermits())
        .description("Ingest requests being processed")
        .register(meters);
    this.rejected =
        Counter.builder(MetricNames.INGEST_REJECTED_BUSY)
            .description("Ingest requests refused with 503 because the limit was reached")
            .register(meters);
  }

  @Override
  protected boolean shouldNotFilter(HttpServletRequest request) {
    return !IngestRequests.matches(request);
  }

  @Override
  protected void doFilterInternal(
      HttpServletRequest request, HttpServletResponse response, FilterChain chain)
      throws ServletException, IOException {
    if (!permits.tryAcquire()) {
      rejected.increment();
      problems.write(
          response,
          ProblemResponses.problem(
              HttpStatus.SERVICE_UNAVAILABLE,
              ProblemTypes.SERVICE_UNAVAILABLE,
              "Busy",
              "Too many ingest requests in progress; nothing of this request was read. Retry later.",
              request),
          retryAfter);
      return;
    }
    try {
      chain.doFilter(request, response);
    } finally {
      permits.release();
    }
  }
}

package org.kwanta.service.system;

import io.micrometer.core.instrument.Counter;
import io.micrometer.core.instrument.Gauge;
import io.micrometer.core.instrument.MeterRegistry;
import jakarta.servlet.FilterChain;
import jakarta.servlet.ReadListener;
import jakarta.servlet.ServletException;
import jakarta.servlet.ServletInputStream;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletRequestWrapper;
import jakarta.servlet.http.HttpServletResponse;
import java.io.BufferedReader;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.Charset;
import java.nio.charset.StandardCharsets;
import java.security.Principal;
import java.time.Duration;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.Semaphore;
import org.springframework.http.HttpStatus;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * Bounds the ingest requests in progress to {@code kwanta.http.max-concurrent-ingests}, and keeps
 * slow or greedy clients from taking every slot:
 *
 * <ul>
 *   <li>the whole body is read <em>before</em> a slot is taken, within {@code
 *       kwanta.http.ingest-body-read-timeout} (408 when a client sends too slowly), so a client
 *       trickling bytes holds a web thread, never an ingest slot;
 *   <li>bodies being read are bounded too ({@code 4 × max-concurrent-ingests}, at most half of them
 *       per key), so slow uploads cannot hold unbounded memory;
 *   <li>while another key has sent in the last ten seconds, one API key holds at most {@code
 *       max-concurrent-ingests − 1} slots (at least one), so another historian finds one free; a
 *       key alone may use them all.
 * </ul>
 *
 * A request that finds no slot is not queued: it is answered at once with 503 and Retry-After.
 * Metrics: {@code kwanta_ingest_in_flight} and {@code kwanta_ingest_rejected_busy_total}.
 */
final class IngestConcurrencyFilter extends OncePerRequestFilter {

  /** Bodies being read at once, per key, as a multiple of the ingest slots. */
  static final int READS_PER_SLOT = 2;

  /** How long a key counts as a competitor for the slots after its last request. */
  static final long ACTIVE_NANOS = 10_000_000_000L;

  private final Semaphore permits;
  private final Semaphore reads;
  private final int perKey;
  private final Duration retryAfter;
  private final Duration readTimeout;
  private final long maxBody;
  private final ProblemResponses problems;
  private final Counter rejected;
  private final int readsPerKey;
  private final ConcurrentHashMap<String, java.util.concurrent.atomic.AtomicInteger> slotsByKey =
      new ConcurrentHashMap<>();
  private final ConcurrentHashMap<String, Semaphore> readsByKey = new ConcurrentHashMap<>();
  private final ConcurrentHashMap<String, Long> lastSeen = new ConcurrentHashMap<>();

  IngestConcurrencyFilter(
      HttpLimitsProperties limits, ProblemResponses problems, MeterRegistry meters) {
    int max = limits.maxConcurrentIngests();
    this.permits = new Semaphore(max);
    this.readsPerKey = READS_PER_SLOT * max;
    this.reads = new Semaphore(2 * readsPerKey);
    this.perKey = Math.max(1, max - 1);
    this.retryAfter = limits.retryAfter();
    this.readTimeout = limits.ingestBodyReadTimeout();
    this.maxBody = limits.maxIngestBodySize().toBytes();
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
    String key = clientOf(request);
    lastSeen.put(key, System.nanoTime());
    Semaphore keyReads = readsByKey.computeIfAbsent(key, k -> new Semaphore(readsPerKey));
    byte[] body;
    if (!keyReads.tryAcquire()) {
      busy(request, response, "Too many uploads of this key in progress");
      return;
    }
    try {
      if (!reads.tryAcquire()) {
        busy(request, response, "Too many uploads in progress");
        return;
      }
      try {
        body = read(request);
      } finally {
        reads.release();
      }
    } catch (SlowUploadException e) {
      problems.write(
          response,
          ProblemResponses.problem(
              HttpStatus.REQUEST_TIMEOUT,
              ProblemTypes.REQUEST_TIMEOUT,
              "Request body too slow",
              "The body did not arrive within "
                  + readTimeout.toSeconds()
                  + " s; nothing of this request was stored. Send it again, faster.",
              request),
          null);
      return;
    } catch (PayloadTooLargeException e) {
      problems.write(
          response,
          ProblemResponses.problem(
              HttpStatus.CONTENT_TOO_LARGE,
              ProblemTypes.PAYLOAD_TOO_LARGE,
              "Content too large",
              e.getMessage(),
              request),
          null);
      return;
    } finally {
      keyReads.release();
    }
    java.util.concurrent.atomic.AtomicInteger held =
        slotsByKey.computeIfAbsent(key, k -> new java.util.concurrent.atomic.AtomicInteger());
    if (held.incrementAndGet() > perKey && othersActive(key)) {
      held.decrementAndGet();
      busy(request, response, "This key already uses its share of the ingest slots");
      return;
    }
    try {
      if (!permits.tryAcquire()) {
        busy(request, response, "Too many ingest requests in progress");
        return;
      }
      try {
        chain.doFilter(new CachedBody(request, body), response);
      } finally {
        permits.release();
      }
    } finally {
      held.decrementAndGet();
    }
  }

  /** True when another key sent an ingest request in the last ten seconds. */
  private boolean othersActive(String key) {
    long now = System.nanoTime();
    for (var e : lastSeen.entrySet()) {
      if (!e.getKey().equals(key) && now - e.getValue() < ACTIVE_NANOS) {
        return true;
      }
    }
    return false;
  }

  private void busy(HttpServletRequest request, HttpServletResponse response, String why)
      throws IOException {
    rejected.increment();
    problems.write(
        response,
        ProblemResponses.problem(
            HttpStatus.SERVICE_UNAVAILABLE,
            ProblemTypes.SERVICE_UNAVAILABLE,
            "Busy",
            why + "; nothing of this request was stored. Retry later.",
            request),
        retryAfter);
  }

  /** The API key's id (the authenticated principal), or the client address without one. */
  private static String clientOf(HttpServletRequest request) {
    Principal p = request.getUserPrincipal();
    return p != null ? "key:" + p.getName() : "addr:" + request.getRemoteAddr();
  }

  /** Thrown when the body did not arrive within the read timeout. */
  static final class SlowUploadException extends IOException {
    private static final long serialVersionUID = 1L;

    SlowUploadException() {
      super("request body too slow");
    }
  }

  /** Reads the whole body, within the read timeout and the size limit. */
  private byte[] read(HttpServletRequest request) throws IOException {
    long deadline = System.nanoTime() + readTimeout.toNanos();
    long length = request.getContentLengthLong();
    ByteArrayOutputStream out =
        new ByteArrayOutputStream(length > 0 && length <= maxBody ? (int) length : 8192);
    byte[] buffer = new byte[16384];
    InputStream in = request.getInputStream();
    long total = 0;
    int n;
    while ((n = in.read(buffer)) != -1) {
      total += n;
      if (total > maxBody) {
        throw new PayloadTooLargeException(maxBody);
      }
      out.write(buffer, 0, n);
      if (System.nanoTime() - deadline > 0) {
        throw new SlowUploadException();
      }
    }
    return out.toByteArray();
  }

  /** The request with its body already read. */
  static final class CachedBody extends HttpServletRequestWrapper {
    private final byte[] body;

    CachedBody(HttpServletRequest request, byte[] body) {
      super(request);
      this.body = body;
    }

    @Override
    public ServletInputStream getInputStream() {
      ByteArrayInputStream in = new ByteArrayInputStream(body);
      return new ServletInputStream() {
        @Override
        public int read() {
          return in.read();
        }

        @Override
        public int read(byte[] b, int off, int len) {
          return in.read(b, off, len);
        }

        @Override
        public boolean isFinished() {
          return in.available() == 0;
        }

        @Override
        public boolean isReady() {
          return true;
        }

        @Override
        public void setReadListener(ReadListener listener) {
          throw new UnsupportedOperationException("blocking reads only");
        }
      };
    }

    @Override
    public BufferedReader getReader() {
      String encoding = getCharacterEncoding();
      Charset charset = encoding == null ? StandardCharsets.UTF_8 : Charset.forName(encoding);
      return new BufferedReader(new InputStreamReader(new ByteArrayInputStream(body), charset));
    }

    @Override
    public int getContentLength() {
      return body.length;
    }

    @Override
    public long getContentLengthLong() {
      return body.length;
    }
  }
}

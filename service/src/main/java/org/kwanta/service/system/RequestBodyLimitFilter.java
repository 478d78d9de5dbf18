package org.kwanta.service.system;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ReadListener;
import jakarta.servlet.ServletException;
import jakarta.servlet.ServletInputStream;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletRequestWrapper;
import jakarta.servlet.http.HttpServletResponse;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.Charset;
import java.nio.charset.StandardCharsets;
import org.springframework.http.HttpStatus;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * Caps request bodies: {@code max-ingest-body-size} on ingest and the what-if diagnosis, {@code
 * max-body-size} elsewhere. A declared Content-Length over the cap is refused before reading (413);
 * a chunked body is counted as it is read and the read fails past the cap, which {@link
 * ProblemHandler} answers with 413.
 */
final class RequestBodyLimitFilter extends OncePerRequestFilter {

  private final long maxBody;
  private final long maxIngestBody;
  private final ProblemResponses problems;

  RequestBodyLimitFilter(HttpLimitsProperties limits, ProblemResponses problems) {
    this.maxBody = limits.maxBodySize().toBytes();
    this.maxIngestBody = limits.maxIngestBodySize().toBytes();
    this.problems = problems;
  }

  @Override
  protected void doFilterInternal(
      HttpServletRequest request, HttpServletResponse response, FilterChain chain)
      throws ServletException, IOException {
    long limit = IngestRequests.carriesReadings(request) ? maxIngestBody : maxBody;
    if (request.getContentLengthLong() > limit) {
      problems.write(
          response,
          ProblemResponses.problem(
              HttpStatus.CONTENT_TOO_LARGE,
              ProblemTypes.PAYLOAD_TOO_LARGE,
              "Content too large",
              new PayloadTooLargeException(limit).getMessage(),
              request),
          null);
      return;
    }
    chain.doFilter(new Limited(request, limit), response);
  }

  private static final class Limited extends HttpServletRequestWrapper {
    private final long limit;
    private LimitedInputStream stream;

    Limited(HttpServletRequest request, long limit) {
      super(request);
      this.limit = limit;
    }

    @Override
    public ServletInputStream getInputStream() throws IOException {
      if (stream == null) {
        stream = new LimitedInputStream(super.getInputStream(), limit);
      }
      return stream;
    }

    @Override
    public BufferedReader getReader() throws IOException {
      String encoding = getCharacterEncoding();
      Charset charset = encoding == null ? StandardCharsets.UTF_8 : Charset.forName(encoding);
      return new BufferedReader(new InputStreamReader(getInputStream(), charset));
    }
  }

  private static final class LimitedInputStream extends ServletInputStream {
    private final ServletInputStream in;
    private final long limit;
    private long count;

    LimitedInputStream(ServletInputStream in, long limit) {
      this.in = in;
      this.limit = limit;
    }

    @Override
    public int read() throws IOException {
      int b = in.read();
      if (b >= 0) {
        counted(1);
      }
      return b;
    }

    @Override
    public int read(byte[] buffer, int offset, int length) throws IOException {
      int n = in.read(buffer, offset, length);
      if (n > 0) {
        counted(n);
      }
      return n;
    }

    private void counted(int n) throws PayloadTooLargeException {
      count += n;
      if (count > limit) {
        throw new PayloadTooLargeException(limit);
      }
    }

    @Override
    public boolean isFinished() {
      return in.isFinished();
    }

    @Override
    public boolean isReady() {
      return in.isReady();
    }

    @Override
    public void setReadListener(ReadListener listener) {
      in.setReadListener(listener);
    }

    @Override
    public void close() throws IOException {
      in.close();
    }
  }
}

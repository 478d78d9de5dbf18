package org.kwanta.service.system;

import jakarta.servlet.http.HttpServletRequest;

/** Which requests are ingest: {@code POST /api/v1/readings} and everything below it. */
final class IngestRequests {

  static final String PATH = "/api/v1/readings";

  private IngestRequests() {}

  static boolean matches(HttpServletRequest request) {
    if (!"POST".equals(request.getMethod())) {
      return false;
    }
    String path = request.getRequestURI().substring(request.getContextPath().length());
    return path.equals(PATH) || path.startsWith(PATH + "/");
  }

  /**
   * Requests whose body is a batch of readings: ingest, and the what-if diagnosis ({@code POST
   * /api/v1/sample-points/{samplePoint}/diagnosis}), which takes the same body and so the same size
   * limit.
   */
  static boolean carriesReadings(HttpServletRequest request) {
    if (matches(request)) {
      return true;
    }
    if (!"POST".equals(request.getMethod())) {
      return false;
    }
    String path = request.getRequestURI().substring(request.getContextPath().length());
    return path.startsWith("/api/v1/sample-points/") && path.endsWith("/diagnosis");
  }
}

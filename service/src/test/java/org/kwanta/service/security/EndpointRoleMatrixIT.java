package org.kwanta.service.security;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.beans.factory.annotation.Qualifier;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.web.bind.annotation.RequestMethod;
import org.springframework.web.servlet.mvc.method.RequestMappingInfo;
import org.springframework.web.servlet.mvc.method.annotation.RequestMappingHandlerMapping;
import org.springframework.web.util.pattern.PathPattern;
import org.springframework.web.util.pattern.PathPatternParser;

/**
 * Every endpoint × every caller: no key, a malformed key, an ingest key, a read key, an admin key.
 * The endpoints come from the application's own request mappings, so an endpoint added later is
 * checked without editing this test; the expectations come from the table below, written
 * independently of the security configuration. A mapping that no row covers fails the test.
 */
@DatabaseTest
class EndpointRoleMatrixIT {

  private static final Logger log = LoggerFactory.getLogger(EndpointRoleMatrixIT.class);

  /** Who may call: nobody needs a key (OPEN), or the least role that may. */
  enum Access {
    OPEN,
    /** any valid key, of whatever role */
    ANY_KEY,
    INGEST,
    READ,
    CHEMIST,
    ADMIN
  }

  private record Row(String method, PathPattern pattern, Access access) {
    boolean covers(String m, String path) {
      return (method.equals("*") || method.equals(m))
          && pattern.matches(org.springframework.http.server.PathContainer.parsePath(path));
    }
  }

  private static final PathPatternParser PARSER = PathPatternParser.defaultInstance;

  /** The expectation table, first match wins: the contract of issue 8. */
  private static final List<Row> TABLE =
      List.of(
          row("GET", "/api/v1/caller", Access.ANY_KEY),
          row("*", "/api/v1/keys/**", Access.ADMIN),
          row("POST", "/api/v1/readings/**", Access.INGEST),
          row("*", "/api/v1/audit/**", Access.CHEMIST),
          row("POST", "/api/v1/excursions/acknowledgements", Access.CHEMIST),
          row("POST", "/api/v1/excursion-events/**", Access.CHEMIST),
          row("PUT", "/api/v1/sample-points/*/limits/*", Access.CHEMIST),
          row("DELETE", "/api/v1/sample-points/*/limits/*", Access.CHEMIST),
          row("POST", "/api/v1/plants/*/blocks/*/operating-states", Access.CHEMIST),
          row("POST", "/api/v1/sample-points/*/instrument-checks", Access.CHEMIST),
          row("POST", "/api/v1/lab-results", Access.CHEMIST),
          row("GET", "/api/**", Access.READ),
          row("HEAD", "/api/**", Access.READ),
          row("POST", "/api/v1/chemistry/**", Access.READ),
          row("POST", "/api/v1/sample-points/*/diagnosis", Access.READ),
          row("*", "/api/**", Access.ADMIN),
          row("*", "/v3/api-docs/**", Access.OPEN),
          row("*", "/v3/api-docs.yaml", Access.OPEN),
          row("*", "/swagger-ui.html", Access.OPEN),
          row("*", "/swagger-ui/**", Access.OPEN));

  /** Actuator endpoints live outside Spring MVC's mapping; listed here. */
  private static final Map<String, Access> ACTUATOR =
      Map.of(
          "/actuator/health", Access.OPEN,
          "/actuator/health/liveness", Access.OPEN,
          "/actuator/health/readiness", Access.OPEN,
          "/actuator/info", Access.OPEN,
          "/actuator/prometheus", Access.READ,
          "/actuator", Access.ADMIN);

  /** Mappings not checked: the error page, reached only by error dispatch. */
  private static final Set<String> NOT_ENDPOINTS = Set.of("/error");

  private static Row row(String method, String pattern, Access access) {
    return new Row(method, PARSER.parse(pattern), access);
  }

  @LocalServerPort int port;

  @Autowired
  @Qualifier("requestMappingHandlerMapping")
  RequestMappingHandlerMapping mappings;

  @Test
  void everyEndpointAnswersEveryRoleAsTheTableSays() {
    Map<Access, String> keys =
        Map.of(
            Access.INGEST, Keys.createKey(port, "matrix ingest", "ingest"),
            Access.READ, Keys.createKey(port, "matrix read", "read"),
            Access.CHEMIST, Keys.createKey(port, "matrix chemist", "chemist"),
            Access.ADMIN, org.kwanta.service.support.TestKeys.ADMIN);
    Set<String> endpoints = new LinkedHashSet<>();
    List<String> unmapped = new ArrayList<>();
    for (RequestMappingInfo info : mappings.getHandlerMethods().keySet()) {
      Set<RequestMethod> methods = info.getMethodsCondition().getMethods();
      for (String pattern : info.getPatternValues()) {
        if (NOT_ENDPOINTS.contains(pattern)) {
          continue;
        }
        for (RequestMethod m :
            methods.isEmpty() ? Set.of(RequestMethod.GET, RequestMethod.POST) : methods) {
          endpoints.add(m.name() + " " + concrete(pattern));
        }
      }
    }
    List<String> failures = java.util.Collections.synchronizedList(new ArrayList<>());
    Set<String> tested = new TreeSet<>();
    List<String[]> calls = new ArrayList<>();
    for (String endpoint : endpoints) {
      String method = endpoint.substring(0, endpoint.indexOf(' '));
      String path = endpoint.substring(endpoint.indexOf(' ') + 1);
      Access access =
          TABLE.stream()
              .filter(r -> r.covers(method, path))
              .map(Row::access)
              .findFirst()
              .orElse(null);
      if (access == null) {
        unmapped.add(endpoint);
        continue;
      }
      calls.add(new String[] {method, path, access.name()});
      tested.add(endpoint + " -> " + access);
    }
    for (Map.Entry<String, Access> e : ACTUATOR.entrySet()) {
      calls.add(new String[] {"GET", e.getKey(), e.getValue().name()});
      tested.add("GET " + e.getKey() + " -> " + e.getValue());
    }
    // the calls change nothing (no bodies), so they go four at a time
    java.util.concurrent.ExecutorService pool =
        java.util.concurrent.Executors.newFixedThreadPool(4);
    int checks = 0;
    try {
      List<java.util.concurrent.Future<Integer>> done = new ArrayList<>();
      for (String[] c : calls) {
        done.add(pool.submit(() -> check(c[0], c[1], Access.valueOf(c[2]), keys, failures)));
      }
      for (java.util.concurrent.Future<Integer> f : done) {
        checks += f.get();
      }
    } catch (InterruptedException | java.util.concurrent.ExecutionException e) {
      throw new IllegalStateException(e);
    } finally {
      pool.shutdownNow();
    }
    log.info(
        "Role matrix: {} endpoints x 6 callers = {} checks:\n  {}",
        tested.size(),
        checks,
        String.join("\n  ", tested));
    assertThat(unmapped).as("endpoints with no row in the expectation table").isEmpty();
    assertThat(failures).as("role matrix failures").isEmpty();
    assertThat(tested)
        .as("the matrix found the known endpoints")
        .anyMatch(s -> s.startsWith("POST /api/v1/plants "))
        .anyMatch(s -> s.startsWith("GET /api/v1/water "))
        .anyMatch(s -> s.startsWith("DELETE /api/v1/keys/"))
        .anyMatch(
            s -> s.startsWith("POST /api/v1/plants/matrix-x/blocks/matrix-x/operating-states "))
        .anyMatch(s -> s.startsWith("GET /api/v1/plants/matrix-x/reports/monthly "))
        .anyMatch(s -> s.startsWith("POST /api/v1/sample-points/matrix-x/instrument-checks "))
        .anyMatch(s -> s.startsWith("POST /api/v1/lab-results -> CHEMIST"))
        .anyMatch(s -> s.startsWith("GET /api/v1/sample-points/matrix-x/lab-results -> READ"));
  }

  /** Six callers on one endpoint; returns the number of checks. */
  private int check(
      String method, String path, Access access, Map<Access, String> keys, List<String> failures) {
    Http anonymous = new Http(port);
    expect(
        failures,
        method,
        path,
        "no key",
        call(anonymous, method, path),
        access == Access.OPEN ? null : 401);
    expect(
        failures,
        method,
        path,
        "malformed key",
        call(anonymous.withKey("kw_bad"), method, path),
        access == Access.OPEN ? null : 401);
    for (Access role : List.of(Access.INGEST, Access.READ, Access.CHEMIST, Access.ADMIN)) {
      boolean allowed =
          access == Access.OPEN
              || access == Access.ANY_KEY
              || role == Access.ADMIN
              || role == access
              || role == Access.CHEMIST && access == Access.READ;
      expect(
          failures,
          method,
          path,
          role.name().toLowerCase(java.util.Locale.ROOT) + " key",
          call(anonymous.withKey(keys.get(role)), method, path),
          allowed ? null : 403);
    }
    return 6;
  }

  /** expected null: allowed, so anything but 401 and 403 (400, 404 and 415 are fine). */
  private static void expect(
      List<String> failures,
      String method,
      String path,
      String caller,
      HttpResponse<String> r,
      Integer expected) {
    int status = r.statusCode();
    boolean ok;
    if (expected == null) {
      ok = status != 401 && status != 403 && status < 500;
    } else {
      ok =
          status == expected
              && r.headers()
                  .firstValue("Content-Type")
                  .orElse("")
                  .startsWith("application/problem+json")
              && r.body()
                  .contains(
                      expected == 401
                          ? "urn:kwanta:problem:unauthorized"
                          : "urn:kwanta:problem:forbidden");
    }
    if (!ok) {
      failures.add(
          method
              + " "
              + path
              + " with "
              + caller
              + ": expected "
              + (expected == null ? "allowed" : expected)
              + ", got "
              + status
              + " "
              + r.body());
    }
  }

  /** A request without a body: it cannot change anything even where it is allowed. */
  private static HttpResponse<String> call(Http http, String method, String path) {
    HttpRequest.BodyPublisher empty = HttpRequest.BodyPublishers.noBody();
    HttpRequest.Builder b = HttpRequest.newBuilder(http.uri(path)).method(method, empty);
    if (!method.equals("GET") && !method.equals("DELETE")) {
      b.header("Content-Type", "application/json");
    }
    return http.send(b);
  }

  /** A path for a pattern: each variable replaced by a value that names nothing stored. */
  static String concrete(String pattern) {
    return pattern
        .replaceAll("\\{\\*[^}]+}", "matrix-x")
        .replaceAll("\\{[^}]+}", "matrix-x")
        .replace("/**", "/matrix-x")
        .replace("*", "matrix-x");
  }
}

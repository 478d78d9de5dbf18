package org.kwanta.service.system;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.util.Locale;
import org.springframework.boot.security.autoconfigure.web.servlet.SecurityFilterProperties;
import org.springframework.boot.web.servlet.FilterRegistrationBean;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * GET and HEAD requests to the API read in a read scope ({@link ReadSource}) and say where they
 * read: {@code Kwanta-Read-Source: replica|primary}, {@code Kwanta-Replica-Lag: <seconds>} when
 * measured, and {@code Kwanta-Read-Fallback: lag|unreachable} when a configured replica was passed
 * over. Without a replica the answers carry no such header. Runs after the access rules, so an
 * unauthenticated request never measures the replica.
 */
@Configuration(proxyBeanMethods = false)
class ReadReplicaConfiguration {

  static final String SOURCE_HEADER = "Kwanta-Read-Source";
  static final String LAG_HEADER = "Kwanta-Replica-Lag";
  static final String FALLBACK_HEADER = "Kwanta-Read-Fallback";

  @Bean
  ReplicaLag replicaLag() {
    return ReplicaLag.REPLAY;
  }

  @Bean
  FilterRegistrationBean<Filter> readSourceFilter(ReadSource reads, ReplicaProperties properties) {
    FilterRegistrationBean<Filter> registration = new FilterRegistrationBean<>(new Filter(reads));
    registration.setOrder(SecurityFilterProperties.DEFAULT_FILTER_ORDER + 10);
    registration.addUrlPatterns("/api/*");
    registration.setEnabled(properties.enabled());
    return registration;
  }

  static final class Filter extends OncePerRequestFilter {
    private final ReadSource reads;

    Filter(ReadSource reads) {
      this.reads = reads;
    }

    @Override
    protected boolean shouldNotFilter(HttpServletRequest request) {
      String method = request.getMethod();
      return !"GET".equals(method) && !"HEAD".equals(method);
    }

    @Override
    protected void doFilterInternal(
        HttpServletRequest request, HttpServletResponse response, FilterChain chain)
        throws ServletException, IOException {
      ReadSource.Decision decision = reads.decide();
      response.setHeader(SOURCE_HEADER, decision.replica() ? "replica" : "primary");
      decision
          .lag()
          .ifPresent(
              lag ->
                  response.setHeader(
                      LAG_HEADER, String.format(Locale.ROOT, "%.3f", lag.toNanos() / 1e9)));
      if (!decision.replica() && decision.reason() != ReadSource.Reason.NO_REPLICA) {
        response.setHeader(FALLBACK_HEADER, decision.reason().name().toLowerCase(Locale.ROOT));
      }
      try {
        reads.onReplica(
            decision,
            () -> {
              try {
                chain.doFilter(request, response);
                return null;
              } catch (IOException | ServletException e) {
                throw new FilterFailure(e);
              }
            });
      } catch (FilterFailure f) {
        if (f.getCause() instanceof IOException io) {
          throw io;
        }
        throw (ServletException) f.getCause();
      }
    }
  }

  /** Carries a checked filter exception through the read scope's supplier. */
  private static final class FilterFailure extends RuntimeException {
    FilterFailure(Exception cause) {
      super(cause);
    }
  }
}

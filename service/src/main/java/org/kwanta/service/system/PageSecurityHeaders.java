package org.kwanta.service.system;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import org.springframework.boot.security.autoconfigure.web.servlet.SecurityFilterProperties;
import org.springframework.boot.web.servlet.FilterRegistrationBean;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * A strict Content-Security-Policy on the chemist page, its assets and the API's answers: scripts,
 * styles, images and requests only from this origin, no inline script or style, no plugins, no
 * framing, no foreign form targets. Data from the API (a sample point's name, a note) can then not
 * run as script even if a page bug put it into markup. Swagger UI keeps its own page without the
 * header (its bundled page is not ours to vet). Set before the access rules, so a 401 carries it
 * too.
 */
@Configuration(proxyBeanMethods = false)
class PageSecurityHeaders {

  /** The policy; {@code data:} images only for the page's empty favicon. */
  static final String POLICY =
      "default-src 'none'; script-src 'self'; style-src 'self'; img-src 'self' data:;"
          + " connect-src 'self'; font-src 'self'; manifest-src 'self'; base-uri 'none';"
          + " form-action 'self'; frame-ancestors 'none'; object-src 'none'";

  @Bean
  FilterRegistrationBean<Filter> pageSecurityHeadersFilter() {
    FilterRegistrationBean<Filter> registration = new FilterRegistrationBean<>(new Filter());
    registration.setOrder(SecurityFilterProperties.DEFAULT_FILTER_ORDER - 20);
    return registration;
  }

  static final class Filter extends OncePerRequestFilter {
    @Override
    protected void doFilterInternal(
        HttpServletRequest request, HttpServletResponse response, FilterChain chain)
        throws ServletException, IOException {
      String path = request.getRequestURI().substring(request.getContextPath().length());
      if (!path.startsWith("/swagger-ui")) {
        response.setHeader("Content-Security-Policy", POLICY);
        response.setHeader("Referrer-Policy", "no-referrer");
      }
      chain.doFilter(request, response);
    }
  }
}

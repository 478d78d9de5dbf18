package org.kwanta.service.system;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletRequestWrapper;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * Treats {@code /actuator/<endpoint>/} as {@code /actuator/<endpoint>}: a scraper configured with a
 * trailing slash got 403 (the access rules, which match exact paths, fell through to the admin-only
 * {@code /actuator/**}) and, past them, 404. The request is passed on with the slash removed,
 * before the access rules, so both see the same path.
 */
final class ActuatorTrailingSlashFilter extends OncePerRequestFilter {

  private static final String PREFIX = "/actuator/";

  @Override
  protected void doFilterInternal(
      HttpServletRequest request, HttpServletResponse response, FilterChain chain)
      throws ServletException, IOException {
    String path = request.getRequestURI().substring(request.getContextPath().length());
    if (path.startsWith(PREFIX) && path.length() > PREFIX.length() + 1 && path.endsWith("/")) {
      chain.doFilter(new WithoutTrailingSlash(request), response);
    } else {
      chain.doFilter(request, response);
    }
  }

  private static final class WithoutTrailingSlash extends HttpServletRequestWrapper {

    WithoutTrailingSlash(HttpServletRequest request) {
      super(request);
    }

    @Override
    public String getRequestURI() {
      return strip(super.getRequestURI());
    }

    @Override
    public StringBuffer getRequestURL() {
      return new StringBuffer(strip(super.getRequestURL().toString()));
    }

    @Override
    public String getServletPath() {
      return strip(super.getServletPath());
    }

    @Override
    public String getPathInfo() {
      String info = super.getPathInfo();
      return info == null ? null : strip(info);
    }

    private static String strip(String s) {
      return s.endsWith("/") && s.length() > 1 ? s.substring(0, s.length() - 1) : s;
    }
  }
}

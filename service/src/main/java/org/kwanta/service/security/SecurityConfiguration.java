package org.kwanta.service.security;

import jakarta.servlet.DispatcherType;
import org.kwanta.service.system.DatabaseOutage;
import org.kwanta.service.system.ProblemResponses;
import org.springframework.boot.security.autoconfigure.web.servlet.PathRequest;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.http.HttpMethod;
import org.springframework.security.config.annotation.web.builders.HttpSecurity;
import org.springframework.security.config.annotation.web.configurers.AbstractHttpConfigurer;
import org.springframework.security.config.http.SessionCreationPolicy;
import org.springframework.security.web.SecurityFilterChain;
import org.springframework.security.web.authentication.AnonymousAuthenticationFilter;

/**
 * Who may call what, by URL pattern and method, so that endpoints added later fall under a rule
 * without touching this class:
 *
 * <table>
 *   <caption>Rules, first match wins</caption>
 *   <tr><th>request</th><th>needs</th></tr>
 *   <tr><td>health, info, OpenAPI, Swagger UI, {@code GET}/{@code HEAD /}, {@code /report.html},
 *       static assets</td>
 *       <td>nothing</td></tr>
 *   <tr><td>{@code GET /actuator/prometheus}</td><td>read</td></tr>
 *   <tr><td>other {@code /actuator/**}</td><td>admin</td></tr>
 *   <tr><td>{@code GET /api/v1/caller} (who the key is)</td><td>any valid key</td></tr>
 *   <tr><td>{@code /api/v1/keys/**}, any method</td><td>admin</td></tr>
 *   <tr><td>{@code POST /api/v1/readings/**}</td><td>ingest</td></tr>
 *   <tr><td>{@code /api/v1/audit/**}; {@code POST /api/v1/excursions/acknowledgements}, {@code
 *       POST /api/v1/excursion-events/**};
 *       {@code PUT}/{@code DELETE /api/v1/sample-points/*}{@code /limits/*}; {@code POST
 *       /api/v1/plants/*}{@code /blocks/*}{@code /operating-states}, {@code POST
 *       /api/v1/sample-points/*}{@code /instrument-checks}</td><td>chemist</td></tr>
 *   <tr><td>{@code GET}/{@code HEAD /api/**}</td><td>read</td></tr>
 *   <tr><td>{@code POST /api/v1/chemistry/**} (calculations that store nothing)</td><td>read</td></tr>
 *   <tr><td>anything else under {@code /api/**}, and any other path</td><td>admin</td></tr>
 * </table>
 *
 * Admin keys hold the chemist, read and ingest roles too, chemist keys the read role ({@link
 * Role#authorities()}). Stateless: no session, no cookie, no CSRF token (a key in a header cannot
 * be sent by a foreign page).
 */
@Configuration(proxyBeanMethods = false)
class SecurityConfiguration {

  static final String INGEST = Role.INGEST.name();
  static final String READ = Role.READ.name();
  static final String CHEMIST = Role.CHEMIST.name();
  static final String ADMIN = Role.ADMIN.name();

  @Bean
  SecurityFilterChain apiKeySecurity(
      HttpSecurity http, ApiKeys keys, ProblemResponses problems, DatabaseOutage outage)
      throws Exception {
    ProblemEntryPoint entryPoint = new ProblemEntryPoint(problems, outage);
    http.csrf(AbstractHttpConfigurer::disable)
        .formLogin(AbstractHttpConfigurer::disable)
        .httpBasic(AbstractHttpConfigurer::disable)
        .logout(AbstractHttpConfigurer::disable)
        .requestCache(AbstractHttpConfigurer::disable)
        .sessionManagement(s -> s.sessionCreationPolicy(SessionCreationPolicy.STATELESS))
        .exceptionHandling(
            e -> e.authenticationEntryPoint(entryPoint).accessDeniedHandler(entryPoint))
        .addFilterBefore(new ApiKeyFilter(keys), AnonymousAuthenticationFilter.class)
        .authorizeHttpRequests(
            a ->
                a.dispatcherTypeMatchers(DispatcherType.ERROR)
                    .permitAll()
                    .requestMatchers("/actuator/health", "/actuator/health/**", "/actuator/info")
                    .permitAll()
                    .requestMatchers(HttpMethod.GET, "/actuator/prometheus")
                    .hasRole(READ)
                    .requestMatchers("/actuator", "/actuator/**")
                    .hasRole(ADMIN)
                    .requestMatchers(
                        "/v3/api-docs",
                        "/v3/api-docs.yaml",
                        "/v3/api-docs/**",
                        "/swagger-ui.html",
                        "/swagger-ui/**")
                    .permitAll()
                    .requestMatchers(
                        HttpMethod.GET,
                        "/",
                        "/index.html",
                        "/report.html",
                        "/favicon.ico",
                        "/assets/**")
                    .permitAll()
                    .requestMatchers(
                        HttpMethod.HEAD,
                        "/",
                        "/index.html",
                        "/report.html",
                        "/favicon.ico",
                        "/assets/**")
                    .permitAll()
                    .requestMatchers(PathRequest.toStaticResources().atCommonLocations())
                    .permitAll()
                    .requestMatchers(HttpMethod.GET, "/api/v1/caller")
                    .authenticated()
                    .requestMatchers("/api/v1/keys", "/api/v1/keys/**")
                    .hasRole(ADMIN)
                    .requestMatchers(HttpMethod.POST, "/api/v1/readings", "/api/v1/readings/**")
                    .hasRole(INGEST)
                    // the chemistry record: the audit log, acknowledgements, limits
                    .requestMatchers("/api/v1/audit", "/api/v1/audit/**")
                    .hasRole(CHEMIST)
                    .requestMatchers(HttpMethod.POST, "/api/v1/excursions/acknowledgements")
                    .hasRole(CHEMIST)
                    .requestMatchers(
                        HttpMethod.POST, "/api/v1/excursion-events", "/api/v1/excursion-events/**")
                    .hasRole(CHEMIST)
                    .requestMatchers(HttpMethod.PUT, "/api/v1/sample-points/*/limits/*")
                    .hasRole(CHEMIST)
                    // the block's operating state and the instrument log (issue 14)
                    .requestMatchers(HttpMethod.POST, "/api/v1/plants/*/blocks/*/operating-states")
                    .hasRole(CHEMIST)
                    .requestMatchers(HttpMethod.POST, "/api/v1/sample-points/*/instrument-checks")
                    .hasRole(CHEMIST)
                    .requestMatchers(HttpMethod.POST, "/api/v1/lab-results")
                    .hasRole(CHEMIST)
                    .requestMatchers(HttpMethod.DELETE, "/api/v1/sample-points/*/limits/*")
                    .hasRole(CHEMIST)
                    .requestMatchers(HttpMethod.GET, "/api/**")
                    .hasRole(READ)
                    .requestMatchers(HttpMethod.HEAD, "/api/**")
                    .hasRole(READ)
                    .requestMatchers(HttpMethod.POST, "/api/v1/chemistry", "/api/v1/chemistry/**")
                    .hasRole(READ)
                    // what-if diagnosis: a calculation on posted readings, stores nothing
                    .requestMatchers(HttpMethod.POST, "/api/v1/sample-points/*/diagnosis")
                    .hasRole(READ)
                    .anyRequest()
                    .hasRole(ADMIN));
    return http.build();
  }
}

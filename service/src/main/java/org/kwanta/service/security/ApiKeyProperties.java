package org.kwanta.service.security;

import org.springframework.boot.context.properties.ConfigurationProperties;

/**
 * Key settings.
 *
 * @param adminKey an admin key to install at start ({@code kw_<id>_<secret>}, secret of at least 32
 *     characters {@code A-Za-z0-9_-}); set it through the environment variable {@code
 *     KWANTA_ADMIN_KEY}. Empty: at the first start (no active admin key in the database) one is
 *     generated and printed once in the log.
 */
@ConfigurationProperties("kwanta.security")
public record ApiKeyProperties(String adminKey) {}

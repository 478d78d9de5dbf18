package org.kwanta.service.security;

import org.springframework.boot.context.properties.ConfigurationProperties;

/**
 * Key settings.
 *
 * @param adminKey an admin key to install at start ({@code kw_<id>_<secret>}, secret of at least 32
 *     characters {@code A-Za-z0-9_-}); set it through the environment variable {@code
 *     KWANTA_ADMIN_KEY}. Empty: at the first start (no active admin key in the database) one is
 *     generated and printed once in the log.
 * @param scrapeKeyFile a file holding the {@code read} key of the metrics scraper (Prometheus); set
 *     it through {@code KWANTA_SCRAPE_KEY_FILE}. When the file exists its key is installed at start
 *     (a mounted Kubernetes Secret); when it does not, a key is generated and written there for the
 *     scraper to read (docker compose, {@code check-alert.sh}). Empty: no scrape key.
 */
@ConfigurationProperties("kwanta.security")
public record ApiKeyProperties(String adminKey, String scrapeKeyFile) {}

package org.kwanta.service.support;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.time.Duration;

/**
 * A plain JDK HTTP client for tests against the running service; {@link #withKey} sends an API key
 * with every request.
 */
public final class Http {

  private static final HttpClient CLIENT =
      HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).build();

  private final String base;
  private final String key;

  public Http(int port) {
    this("http://localhost:" + port, null);
  }

  private Http(String base, String key) {
    this.base = base;
    this.key = key;
  }

  /** A client on the test admin key ({@link TestKeys#ADMIN}). */
  public static Http admin(int port) {
    return new Http(port).withKey(TestKeys.ADMIN);
  }

  /** The same client, sending {@code Authorization: Bearer <key>}; null for no key. */
  public Http withKey(String key) {
    return new Http(base, key);
  }

  public HttpResponse<String> get(String path, String... headers) {
    return send(HttpRequest.newBuilder(URI.create(base + path)).GET(), headers);
  }

  public HttpResponse<String> post(
      String path, String contentType, String body, String... headers) {
    return send(
        HttpRequest.newBuilder(URI.create(base + path))
            .header("Content-Type", contentType)
            .POST(HttpRequest.BodyPublishers.ofString(body)),
        headers);
  }

  public HttpResponse<String> send(
      String method, String path, String contentType, String body, String... headers) {
    return send(
        HttpRequest.newBuilder(URI.create(base + path))
            .header("Content-Type", contentType)
            .method(method, HttpRequest.BodyPublishers.ofString(body)),
        headers);
  }

  public URI uri(String path) {
    return URI.create(base + path);
  }

  public HttpResponse<String> method(String method, String path, String... headers) {
    return send(
        HttpRequest.newBuilder(URI.create(base + path))
            .method(method, HttpRequest.BodyPublishers.noBody()),
        headers);
  }

  public HttpResponse<String> send(HttpRequest.Builder builder, String... headers) {
    if (key != null) {
      builder.header("Authorization", "Bearer " + key);
    }
    if (headers.length > 0) {
      builder.headers(headers);
    }
    try {
      return CLIENT.send(
          builder.timeout(Duration.ofSeconds(60)).build(), HttpResponse.BodyHandlers.ofString());
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException(e);
    }
  }
}

package org.kwanta.service.system;

import java.util.Locale;
import org.springframework.http.MediaType;

/** JSON or CSV for endpoints that offer both: {@code format} wins over the Accept header. */
public final class ResponseFormats {

  public static final MediaType TEXT_CSV = MediaType.parseMediaType("text/csv");

  private ResponseFormats() {}

  /**
   * True when CSV is asked for.
   *
   * @param format the {@code format} query parameter ({@code json} or {@code csv}), may be null
   * @param accept the Accept header, may be null
   * @throws ProblemException a format other than json or csv
   */
  public static boolean csvRequested(String format, String accept) {
    if (format != null) {
      return switch (format.trim().toLowerCase(Locale.ROOT)) {
        case "csv" -> true;
        case "json" -> false;
        default -> throw ProblemException.of("format must be json or csv");
      };
    }
    return accept != null && accept.toLowerCase(Locale.ROOT).contains("text/csv");
  }
}

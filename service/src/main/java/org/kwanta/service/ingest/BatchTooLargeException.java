package org.kwanta.service.ingest;

import java.util.Map;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.system.ProblemTypes;
import org.springframework.http.HttpStatus;

/** More readings in one request than allowed. */
public class BatchTooLargeException extends ProblemException {

  private static final long serialVersionUID = 1L;

  public BatchTooLargeException(int size, int limit) {
    super(
        HttpStatus.CONTENT_TOO_LARGE,
        ProblemTypes.PAYLOAD_TOO_LARGE,
        "Batch too large",
        "batch of " + size + " readings exceeds the limit of " + limit + " per request",
        Map.of("limit", limit));
  }
}

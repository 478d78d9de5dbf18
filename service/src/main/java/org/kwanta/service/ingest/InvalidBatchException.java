package org.kwanta.service.ingest;

import java.util.List;
import java.util.Map;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.system.ProblemTypes;
import org.springframework.http.HttpStatus;

/**
 * A batch with at least one invalid reading: nothing of it is stored; the body lists every
 * rejection.
 */
public class InvalidBatchException extends ProblemException {

  private static final long serialVersionUID = 1L;

  private final transient List<RejectedReading> rejected;

  public InvalidBatchException(List<RejectedReading> rejected) {
    super(
        HttpStatus.BAD_REQUEST,
        ProblemTypes.INVALID_READINGS,
        "Invalid readings",
        rejected.size() + " reading(s) rejected; nothing of the batch was stored",
        Map.of("rejected", List.copyOf(rejected)));
    this.rejected = List.copyOf(rejected);
  }

  /**
   * The same refusal with each rejection given the file line of its CSV row.
   *
   * @param lines the line where each data row starts, by row index
   */
  InvalidBatchException withLines(int[] lines) {
    return new InvalidBatchException(
        rejected.stream()
            .map(r -> r.index() < lines.length ? r.atLine(lines[r.index()]) : r)
            .toList());
  }
}

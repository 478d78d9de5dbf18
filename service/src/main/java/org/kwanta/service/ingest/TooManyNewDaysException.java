package org.kwanta.service.ingest;

import java.util.Map;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.system.ProblemTypes;
import org.springframework.http.HttpStatus;

/**
 * A request that would create storage for more new days than one request may ({@code
 * kwanta.ingest.max-new-days-per-request}): each new day is a partition of the readings and one of
 * the evaluations, and a backfill over a year of days would stall other ingest while they are made.
 */
public class TooManyNewDaysException extends ProblemException {

  private static final long serialVersionUID = 1L;

  public TooManyNewDaysException(int newDays, int limit) {
    super(
        HttpStatus.UNPROCESSABLE_CONTENT,
        ProblemTypes.TOO_MANY_NEW_DAYS,
        "Too many new days",
        "the batch reaches "
            + newDays
            + " days that have no storage yet; at most "
            + limit
            + " new days per request (kwanta.ingest.max-new-days-per-request): send a long"
            + " backfill in batches of fewer days",
        Map.of("newDays", newDays, "limit", limit));
  }
}

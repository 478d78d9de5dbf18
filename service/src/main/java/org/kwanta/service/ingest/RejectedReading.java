package org.kwanta.service.ingest;

import com.fasterxml.jackson.annotation.JsonInclude;

/**
 * Why one reading of a batch was refused.
 *
 * @param index position in the batch, from 0 (for CSV: the data row, from 0, not counting the
 *     header)
 * @param field the offending field, or null for the reading as a whole
 * @param reason one sentence
 * @param line for CSV: the line of the file where the row starts, from 1 (the header is line 1);
 *     absent for JSON
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
public record RejectedReading(int index, String field, String reason, Integer line) {

  public RejectedReading(int index, String field, String reason) {
    this(index, field, reason, null);
  }

  /** This rejection with the CSV line of its row. */
  RejectedReading atLine(int fileLine) {
    return new RejectedReading(index, field, reason, fileLine);
  }
}

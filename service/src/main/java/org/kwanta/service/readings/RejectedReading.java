package org.kwanta.service.readings;

/**
 * Why one reading of a batch was refused.
 *
 * @param index position in the batch, from 0 (for CSV: the data row, from 0, not counting the
 *     header)
 * @param field the offending field, or null for the reading as a whole
 * @param reason one sentence
 */
public record RejectedReading(int index, String field, String reason) {}

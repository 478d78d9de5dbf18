package org.kwanta.model.evaluation;

/**
 * One fired check.
 *
 * @param code why
 * @param suspect the instrument (or the sample conditioning, or the process) it points at
 * @param explanation one sentence with the numbers behind it
 */
public record Finding(ReasonCode code, Instrument suspect, String explanation) {}

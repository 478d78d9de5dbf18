package org.kwanta.model.limits;

import java.time.Instant;

/**
 * The classifier's answer for one sample.
 *
 * @param time the sample's time
 * @param value the value classified (canonical unit); the calculated one when {@code
 *     calculatedValue}
 * @param level the confirmed level in force at this time, whatever the doubt about the instrument
 * @param levelSince when the condition behind {@code level} began (its onset, before the
 *     persistence delay confirmed it); the first sample's time at the start of a series
 * @param instrumentInDoubt whether the instrument behind this sample was in doubt; it does not
 *     change {@code level}
 * @param calculatedValue whether {@code value} is a calculated stand-in for the measured value
 */
public record Classification(
    Instant time,
    double value,
    Level level,
    Instant levelSince,
    boolean instrumentInDoubt,
    boolean calculatedValue) {}

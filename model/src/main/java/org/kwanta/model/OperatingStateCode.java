package org.kwanta.model;

import java.util.Optional;

/**
 * The numeric codes of a block's operating state as a historian sends them in the reading {@link
 * Parameter#OPERATING_STATE}. The numbering is Kwanta's own (no standard numbers these states); a
 * historian whose tag uses other numbers maps them before sending.
 *
 * <table>
 *   <caption>Codes</caption>
 *   <tr><th>code</th><th>state</th></tr>
 *   <tr><td>1</td><td>in service</td></tr>
 *   <tr><td>2</td><td>start-up</td></tr>
 *   <tr><td>3</td><td>shut down</td></tr>
 *   <tr><td>4</td><td>layup wet</td></tr>
 *   <tr><td>5</td><td>layup dry</td></tr>
 * </table>
 */
public enum OperatingStateCode {
  /** 1: generating in normal operation. */
  IN_SERVICE(1),
  /** 2: from the first firing to the end of the start-up procedure. */
  START_UP(2),
  /** 3: off and not laid up. */
  SHUT_DOWN(3),
  /** 4: laid up filled with conditioned water. */
  LAYUP_WET(4),
  /** 5: laid up drained and dried. */
  LAYUP_DRY(5);

  private final int code;

  OperatingStateCode(int code) {
    this.code = code;
  }

  /** The number a historian sends. */
  public int code() {
    return code;
  }

  /**
   * The state a reading's value stands for; empty unless the value is exactly one of the codes (1.0
   * is in service; 1.5, 0 and 6 are no state).
   */
  public static Optional<OperatingStateCode> of(double value) {
    for (OperatingStateCode s : values()) {
      if (value == s.code) {
        return Optional.of(s);
      }
    }
    return Optional.empty();
  }
}

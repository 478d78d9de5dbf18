package org.kwanta.service.reports;

import java.util.List;
import java.util.Map;
import org.kwanta.model.limits.Level;

/**
 * Kwanta's chemistry performance index (our own definition, not a published one; docs/report.md has
 * a worked example):
 *
 * <pre>
 *   per channel c (a sample point and parameter with limits), over its in-service hours H_c:
 *     P_c = (0.25·h_AL1 + 0.5·h_AL2 + 1.0·h_AL3 + 1.0·h_SHUTDOWN) / H_c
 *   chemistry score    S = 1 − mean_c P_c
 *   availability score A = mean over core instruments of their availability
 *   index              I = 100 · (0.8·S + 0.2·A)
 * </pre>
 *
 * Weights are a design choice (no source): each action level counts twice the one below it up to
 * AL3, where an hour costs a whole hour; 80 % of the index is the water, 20 % the ability to see
 * it. Channels without in-service hours and instruments without availability are left out; with no
 * channel S is 1, with no instrument A is 1 (the index then says so through its counts).
 */
public final class PerformanceIndex {

  /** Weight of an hour at each level. */
  public static final Map<Level, Double> WEIGHTS =
      Map.of(
          Level.NORMAL, 0.0,
          Level.AL1, 0.25,
          Level.AL2, 0.5,
          Level.AL3, 1.0,
          Level.SHUTDOWN, 1.0);

  /** Share of the chemistry score in the index. */
  public static final double CHEMISTRY_SHARE = 0.8;

  /** Share of the availability score in the index. */
  public static final double AVAILABILITY_SHARE = 0.2;

  private PerformanceIndex() {}

  /**
   * The index and its parts.
   *
   * @param index I, 0 to 100
   * @param chemistryScore S, 0 to 1
   * @param availabilityScore A, 0 to 1
   * @param channels channels in S
   * @param instruments instruments in A
   */
  public record Result(
      double index,
      double chemistryScore,
      double availabilityScore,
      int channels,
      int instruments) {}

  /** The penalty P_c of one channel's in-service hours per level; 0 without hours. */
  public static double penalty(Map<Level, Double> hoursByLevel) {
    double total = 0;
    double weighted = 0;
    for (Map.Entry<Level, Double> e : hoursByLevel.entrySet()) {
      total += e.getValue();
      weighted += WEIGHTS.getOrDefault(e.getKey().actionLevel(), 0.0) * e.getValue();
    }
    return total == 0 ? 0 : weighted / total;
  }

  /**
   * The index from each channel's in-service hours per level and each core instrument's
   * availability (0 to 1; nulls are left out).
   */
  public static Result of(List<Map<Level, Double>> channels, List<Double> availabilities) {
    double penalties = 0;
    int n = 0;
    for (Map<Level, Double> c : channels) {
      if (c.values().stream().mapToDouble(Double::doubleValue).sum() > 0) {
        penalties += penalty(c);
        n++;
      }
    }
    double s = n == 0 ? 1 : 1 - penalties / n;
    double sum = 0;
    int m = 0;
    for (Double a : availabilities) {
      if (a != null) {
        sum += a;
        m++;
      }
    }
    double a = m == 0 ? 1 : sum / m;
    return new Result(100 * (CHEMISTRY_SHARE * s + AVAILABILITY_SHARE * a), s, a, n, m);
  }
}

package org.kwanta.model.aqueous;

import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * A named choice of fits, one preference list per equilibrium. At a temperature the first fit whose
 * stated range contains it is used; when none does, the first fit is evaluated and marked
 * extrapolated. Most lists hold one fit; the organic acids hold two (the 0-60 °C Harned form, then
 * the 0-300 °C database fit).
 *
 * @param id short id of our own, shown in results and in the band (provenance in {@code
 *     description} and the fits' citations)
 * @param description what differs from the default and why
 * @param fits for every {@link Equilibrium}, a non-empty preference list
 */
public record ConstantSet(String id, String description, Map<Equilibrium, List<Fit>> fits) {

  public ConstantSet {
    Map<Equilibrium, List<Fit>> copy = new HashMap<>();
    for (Equilibrium e : Equilibrium.values()) {
      List<Fit> list = fits.get(e);
      if (list == null || list.isEmpty()) {
        throw new IllegalArgumentException("constant set " + id + " has no fit for " + e);
      }
      for (Fit f : list) {
        if (f.equilibrium() != e) {
          throw new IllegalArgumentException(
              "constant set " + id + ": fit " + f.id() + " is not for " + e);
        }
      }
      copy.put(e, List.copyOf(list));
    }
    fits = Map.copyOf(copy);
  }

  /** The fit used for an equilibrium at a temperature (see class comment). */
  public Fit fitAt(Equilibrium equilibrium, double temperatureK) {
    List<Fit> list = fits.get(equilibrium);
    for (Fit f : list) {
      if (!f.isExtrapolatedAt(temperatureK)) {
        return f;
      }
    }
    return list.get(0);
  }

  /**
   * A copy of this set with some preference lists replaced.
   *
   * @param newId id of the new set
   * @param newDescription description of the new set
   * @param replacements the lists to replace
   */
  public ConstantSet with(
      String newId, String newDescription, Map<Equilibrium, List<Fit>> replacements) {
    Map<Equilibrium, List<Fit>> m = new HashMap<>(fits);
    m.putAll(replacements);
    return new ConstantSet(newId, newDescription, m);
  }
}

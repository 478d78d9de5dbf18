/**
 * Normal ranges, action levels and excursions: limit profiles per treatment regime, place in the
 * cycle and parameter; a deterministic classifier with deadband and persistence; excursions with
 * the customary allowances and monthly hours per level.
 *
 * <p>The action-level scheme (AL1 return to normal within one week, AL2 within 24 hours, AL3 within
 * four hours or shut down) is the IAPWS technical guidance usage, recalled from memory and still to
 * be verified against the published documents. Threshold numbers are data, not code: they come from
 * versioned data files, and every one carries its own source text.
 */
package org.kwanta.model.limits;

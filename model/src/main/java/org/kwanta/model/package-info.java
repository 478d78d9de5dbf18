/**
 * Kwanta's chemistry engine: plain Java, no framework, no I/O. Sub-packages: {@code water} (IAPWS
 * water properties), {@code aqueous} (equilibria, activity, speciation), {@code numeric} (root
 * finders).
 */
package org.kwanta.model;

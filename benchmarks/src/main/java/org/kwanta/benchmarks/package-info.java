/** JMH benchmarks of the chemistry engine; see DEVELOPERS.md for how to run them. */
package org.kwanta.benchmarks;

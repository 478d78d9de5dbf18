package org.kwanta.service.support;

/**
 * How deep the database tests go. The everyday build ({@code mvn verify}) runs every test class
 * that is not tagged {@value #THOROUGH} with the smaller figures here; CI ({@code mvn verify
 * -Pprocess-tests}) runs every class, the tagged ones included, with the larger figures ({@code
 * kwanta.test.thorough=true}). A test run on its own with {@code -Dit.test=...} runs at the
 * everyday depth unless the property is given.
 */
public final class Depth {

  /**
   * The JUnit tag of the database test classes (or methods) left to CI: slow ones whose ground is
   * also covered by a faster everyday test. The migrations of old data, each on a database of its
   * own ({@code DefaultsVersion3IT}, {@code DefaultsVersion4IT}, {@code
   * DefaultsActivationMigrationIT}, {@code CompactReadingsMigrationIT}, {@code NamesMigrationIT});
   * the database failing or replicated ({@code TerminatedConnectionsIT}, {@code ReplicaReadsIT});
   * the longer browser walks of {@code PageIT}; the boards kept off the request path through a
   * random feed ({@code BoardsIT}, which waits for the refresh thread at every step; the everyday
   * tests read boards computed on the request, {@code kwanta.board.max-lag=PT0S}).
   */
  public static final String THOROUGH = "thorough";

  private Depth() {}

  /** Whether this run is CI's thorough one. */
  public static boolean thorough() {
    return Boolean.getBoolean("kwanta.test.thorough");
  }

  /** {@code everyday} in the everyday build, {@code thorough} in CI's. */
  public static int of(int everyday, int thorough) {
    return thorough() ? thorough : everyday;
  }
}

package org.kwanta.service.support;

/**
 * The admin key that every test application context installs (as {@code KWANTA_ADMIN_KEY} would),
 * so tests can call protected endpoints; further keys are created over HTTP with it. A test value,
 * not a secret.
 */
public final class TestKeys {

  /** Property that installs the admin key at start. */
  public static final String ADMIN_KEY_PROPERTY = "kwanta.security.admin-key";

  /** Admin key of the test contexts. */
  public static final String ADMIN = "kw_testadmin_0123456789abcdefghijABCDEFGHIJ-_0123456789";

  private TestKeys() {}
}

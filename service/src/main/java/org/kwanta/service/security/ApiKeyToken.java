package org.kwanta.service.security;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.security.SecureRandom;
import java.util.Base64;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * An API key as presented: {@code kw_<id>_<secret>}. The id (1 to 32 lower-case letters and digits)
 * is public and finds the stored row; the secret (at least 32 characters of {@code A-Za-z0-9_-}) is
 * checked against its stored hash.
 *
 * <p>Hashing: SHA-256 over a random 16-byte per-key salt followed by the secret. A slow password
 * hash (bcrypt, Argon2) protects low-entropy human passwords against guessing; a generated secret
 * carries 256 random bits, which no guessing can reach, so a slow hash would only cost CPU on every
 * request (tens of milliseconds each on a small machine) without adding protection. The salt keeps
 * equal secrets from producing equal hashes.
 *
 * @param id public key id
 * @param secret the secret part
 */
record ApiKeyToken(String id, String secret) {

  static final String PREFIX = "kw_";
  private static final Pattern FORMAT =
      Pattern.compile("kw_([a-z0-9]{1,32})_([A-Za-z0-9_-]{32,256})");
  private static final SecureRandom RANDOM = new SecureRandom();
  private static final char[] ID_ALPHABET = "abcdefghijklmnopqrstuvwxyz0123456789".toCharArray();

  /** The key parsed from its text, or empty when the text is not a key of this format. */
  static Optional<ApiKeyToken> parse(String text) {
    if (text == null) {
      return Optional.empty();
    }
    Matcher m = FORMAT.matcher(text.trim());
    return m.matches() ? Optional.of(new ApiKeyToken(m.group(1), m.group(2))) : Optional.empty();
  }

  /** A new key: a 12-character random id and a 256-bit random secret (43 characters). */
  static ApiKeyToken generate() {
    StringBuilder id = new StringBuilder(12);
    for (int i = 0; i < 12; i++) {
      id.append(ID_ALPHABET[RANDOM.nextInt(ID_ALPHABET.length)]);
    }
    byte[] secret = new byte[32];
    RANDOM.nextBytes(secret);
    return new ApiKeyToken(
        id.toString(), Base64.getUrlEncoder().withoutPadding().encodeToString(secret));
  }

  static byte[] newSalt() {
    byte[] salt = new byte[16];
    RANDOM.nextBytes(salt);
    return salt;
  }

  /** SHA-256(salt || secret as UTF-8). */
  byte[] hash(byte[] salt) {
    try {
      MessageDigest sha256 = MessageDigest.getInstance("SHA-256");
      sha256.update(salt);
      return sha256.digest(secret.getBytes(StandardCharsets.UTF_8));
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("SHA-256 is required of every Java platform", e);
    }
  }

  /** Constant-time comparison with a stored hash. */
  boolean matches(byte[] salt, byte[] storedHash) {
    return MessageDigest.isEqual(hash(salt), storedHash);
  }

  /** The key as the client sends it. */
  String text() {
    return PREFIX + id + "_" + secret;
  }

  @Override
  public String toString() {
    return PREFIX + id + "_***"; // never log the secret by accident
  }
}

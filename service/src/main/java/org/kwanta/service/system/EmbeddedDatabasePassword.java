package org.kwanta.service.system;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.FileSystems;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.security.SecureRandom;
import java.util.HexFormat;
import java.util.List;

/**
 * The password of the embedded PostgreSQL's {@code postgres} user, kept in a file beside the data
 * directory ({@code <data-directory>.password}, readable by its owner only), and the client
 * authentication file that makes the server ask for it.
 *
 * <p>initdb (run by the embedded server on an empty directory) trusts every local connection; at
 * each start the service sets this password and, when {@code pg_hba.conf} still trusts anyone,
 * replaces it with one that asks every connection for the password (SCRAM-SHA-256) and reloads the
 * server. A data directory made by an earlier version is converted the same way at its next start.
 */
final class EmbeddedDatabasePassword {

  /** pg_hba.conf of the embedded server: every connection, socket or loopback, gives a password. */
  static final List<String> HBA =
      List.of(
          "# written by Kwanta: every connection to the embedded server gives the password of",
          "# <data-directory>.password (docs/operations.md, \"The embedded database\")",
          "local all all scram-sha-256",
          "host all all 127.0.0.1/32 scram-sha-256",
          "host all all ::1/128 scram-sha-256");

  private EmbeddedDatabasePassword() {}

  /** The password file of a data directory. */
  static Path file(Path dataDirectory) {
    return dataDirectory.resolveSibling(dataDirectory.getFileName() + ".password");
  }

  /** The password in the file, made (32 random bytes, hex) and written when there is none. */
  static String readOrCreate(Path dataDirectory) throws IOException {
    Path file = file(dataDirectory);
    if (Files.exists(file)) {
      String password = Files.readString(file, StandardCharsets.UTF_8).trim();
      if (!password.matches("[0-9a-f]{32,128}")) {
        throw new IOException(
            file + " does not hold an embedded database password (32 to 128 hex digits)");
      }
      return password;
    }
    byte[] bytes = new byte[32];
    new SecureRandom().nextBytes(bytes);
    String password = HexFormat.of().formatHex(bytes);
    Files.createDirectories(file.toAbsolutePath().getParent());
    if (FileSystems.getDefault().supportedFileAttributeViews().contains("posix")) {
      Files.createFile(
          file, PosixFilePermissions.asFileAttribute(PosixFilePermissions.fromString("rw-------")));
    }
    Files.writeString(file, password + "\n", StandardCharsets.UTF_8);
    return password;
  }

  /** True when the data directory's pg_hba.conf is not (yet) the one of {@link #HBA}. */
  static boolean needsHba(Path dataDirectory) throws IOException {
    Path hba = dataDirectory.resolve("pg_hba.conf");
    return !Files.exists(hba) || !Files.readAllLines(hba, StandardCharsets.UTF_8).equals(HBA);
  }

  /** Writes {@link #HBA} into the data directory. */
  static void writeHba(Path dataDirectory) throws IOException {
    Files.write(dataDirectory.resolve("pg_hba.conf"), HBA, StandardCharsets.UTF_8);
  }
}

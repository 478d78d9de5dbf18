package org.kwanta.service.docs;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.fail;

import java.io.IOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.ZoneOffset;
import java.time.ZonedDateTime;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.TestKeys;
import org.springframework.boot.test.web.server.LocalServerPort;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Issue 17, fault 8: the README's examples are executed, so they cannot drift from the service.
 * Every {@code curl} command in the README's {@code sh} blocks is run against the test server (its
 * {@code http://localhost:8080} replaced by the test's address, {@code $KEY} by the test admin key,
 * {@code $(date -u +FORMAT)} by the current UTC time, {@code @file} by a file the same block writes
 * with {@code cat > file <<EOF}), and the response shown under it is checked field by field: a
 * string equals (or, ending in {@code ...}, starts with) the shown one; a number agrees to the
 * digits shown; a shown {@code "status"} is the expected HTTP status (otherwise 2xx).
 */
// A database of its own: the examples run as on a new installation, whatever other tests wrote to
// the
// demo plant's points at the same minutes.
@org.springframework.boot.test.context.SpringBootTest(
    webEnvironment =
        org.springframework.boot.test.context.SpringBootTest.WebEnvironment.RANDOM_PORT)
@org.springframework.test.context.ContextConfiguration(
    initializers = org.kwanta.service.support.TestDatabase.OwnDatabaseInitializer.class)
@org.springframework.boot.micrometer.metrics.test.autoconfigure.AutoConfigureMetrics
class ReadmeExamplesIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();
  private static final HttpClient CLIENT = HttpClient.newHttpClient();
  private static final Pattern FIELD =
      Pattern.compile(
          "\"(\\w+)\"\\s*:\\s*(\"(?:[^\"\\\\]|\\\\.)*\"|-?[0-9][0-9.eE+-]*(?:\\.\\.\\.)?|true|false)");

  @LocalServerPort int port;

  /** A curl command as words, and the response the README shows under it (or null). */
  record Example(List<String> words, String shown) {}

  @Test
  void everyCurlExampleAnswersAsShown() throws Exception {
    String readme = Files.readString(readme());
    Map<String, String> files = new HashMap<>();
    List<Example> examples = new ArrayList<>();
    Matcher block = Pattern.compile("(?s)```sh\\n(.*?)```").matcher(readme);
    while (block.find()) {
      parse(block.group(1), files, examples);
    }
    List<String> failures = new ArrayList<>();
    int run = 0;
    for (Example e : examples) {
      String outcome = run(e, files);
      if (outcome == null) {
        continue; // not runnable here (a file the README does not show)
      }
      run++;
      if (!outcome.isEmpty()) {
        failures.add(String.join(" ", e.words()) + "\n  " + outcome);
      }
    }
    assertThat(failures).isEmpty();
    assertThat(run).as("curl examples run").isGreaterThanOrEqualTo(12);
  }

  /**
   * The project's README: beside the {@code service} module (the tests run in {@code service/}).
   */
  private static Path readme() {
    for (Path dir : List.of(Path.of(".."), Path.of("."))) {
      if (Files.isDirectory(dir.resolve("service")) && Files.exists(dir.resolve("README.md"))) {
        return dir.resolve("README.md");
      }
    }
    throw new IllegalStateException("README.md not found beside the service module");
  }

  /**
   * Splits a shell block into commands (quotes, backslash-newline, comments, here-documents) and
   * the JSON responses shown between them.
   */
  static void parse(String text, Map<String, String> files, List<Example> examples) {
    String[] lines = text.split("\n", -1);
    int i = 0;
    while (i < lines.length) {
      String trimmed = lines[i].trim();
      if (trimmed.isEmpty() || trimmed.startsWith("#")) {
        i++;
        continue;
      }
      if (trimmed.startsWith("{") || trimmed.startsWith("[")) {
        StringBuilder shown = new StringBuilder();
        int depth = 0;
        do {
          shown.append(lines[i]).append('\n');
          depth += balance(lines[i]);
          i++;
        } while (depth > 0 && i < lines.length);
        if (!examples.isEmpty()) {
          Example last = examples.remove(examples.size() - 1);
          examples.add(new Example(last.words(), shown.toString()));
        }
        continue;
      }
      // one command: up to an unquoted newline
      List<String> words = new ArrayList<>();
      StringBuilder word = null;
      char quote = 0;
      String heredoc = null;
      boolean expandHeredoc = true;
      outer:
      while (i < lines.length) {
        String line = lines[i];
        for (int c = 0; c < line.length(); c++) {
          char ch = line.charAt(c);
          if (quote == '\'') {
            if (ch == '\'') {
              quote = 0;
            } else {
              word.append(ch);
            }
          } else if (ch == '$' && line.startsWith("$(", c)) {
            int end = line.indexOf(')', c);
            word = word == null ? new StringBuilder() : word;
            word.append(expand(line.substring(c + 2, end)));
            c = end;
          } else if (ch == '$' && quote != '\'' && line.startsWith("$KEY", c)) {
            word = word == null ? new StringBuilder() : word;
            word.append(TestKeys.ADMIN);
            c += 3;
          } else if (quote == '"') {
            if (ch == '"') {
              quote = 0;
            } else if (ch == '\\' && c + 1 < line.length()) {
              word.append(line.charAt(++c));
            } else {
              word.append(ch);
            }
          } else if (ch == '\'' || ch == '"') {
            quote = ch;
            word = word == null ? new StringBuilder() : word;
          } else if (ch == '\\' && c == line.length() - 1) {
            i++;
            continue outer; // continues on the next line
          } else if (ch == ' ' || ch == '\t') {
            if (word != null) {
              words.add(word.toString());
              word = null;
            }
          } else if (ch == '#' && word == null) {
            break; // comment to the end of the line
          } else if (ch == '<' && line.startsWith("<<", c) && word == null) {
            String delimiter = line.substring(c + 2).trim();
            expandHeredoc = !delimiter.startsWith("'");
            heredoc = delimiter.replace("'", "");
            break;
          } else {
            word = word == null ? new StringBuilder() : word;
            word.append(ch);
          }
        }
        if (quote != 0) {
          word.append('\n');
          i++;
          continue;
        }
        if (word != null) {
          words.add(word.toString());
        }
        i++;
        break;
      }
      if (heredoc != null) {
        StringBuilder content = new StringBuilder();
        while (i < lines.length && !lines[i].equals(heredoc)) {
          content.append(expandHeredoc ? expandAll(lines[i]) : lines[i]).append('\n');
          i++;
        }
        i++;
        int redirect = words.indexOf(">");
        if (!words.isEmpty() && words.get(0).equals("cat") && redirect >= 0) {
          files.put(words.get(redirect + 1), content.toString());
        }
        continue;
      }
      if (!words.isEmpty() && words.get(0).equals("curl")) {
        examples.add(new Example(words, null));
      }
    }
  }

  private static int balance(String line) {
    int depth = 0;
    boolean inString = false;
    for (int c = 0; c < line.length(); c++) {
      char ch = line.charAt(c);
      if (inString) {
        if (ch == '\\') {
          c++;
        } else if (ch == '"') {
          inString = false;
        }
      } else if (ch == '"') {
        inString = true;
      } else if (ch == '{' || ch == '[') {
        depth++;
      } else if (ch == '}' || ch == ']') {
        depth--;
      }
    }
    return depth;
  }

  private static String expandAll(String line) {
    Matcher m = Pattern.compile("\\$\\(([^)]*)\\)").matcher(line);
    StringBuilder out = new StringBuilder();
    while (m.find()) {
      m.appendReplacement(out, Matcher.quoteReplacement(expand(m.group(1))));
    }
    m.appendTail(out);
    return out.toString();
  }

  /** {@code date -u +FORMAT} with %Y %m %d %H %M %S, as GNU and BSD date print it (UTC, now). */
  static String expand(String command) {
    if (!command.startsWith("date -u +")) {
      throw new IllegalArgumentException("only $(date -u +FORMAT) is supported: " + command);
    }
    ZonedDateTime now = ZonedDateTime.now(ZoneOffset.UTC);
    return command
        .substring("date -u +".length())
        .replace("%Y", String.format("%04d", now.getYear()))
        .replace("%m", String.format("%02d", now.getMonthValue()))
        .replace("%d", String.format("%02d", now.getDayOfMonth()))
        .replace("%H", String.format("%02d", now.getHour()))
        .replace("%M", String.format("%02d", now.getMinute()))
        .replace("%S", String.format("%02d", now.getSecond()));
  }

  /** Runs one example; null when it cannot run here, "" when it answered as shown. */
  private String run(Example e, Map<String, String> files)
      throws IOException, InterruptedException {
    String method = null;
    String body = null;
    String url = null;
    HttpRequest.Builder request = HttpRequest.newBuilder();
    List<String> w = e.words();
    for (int k = 1; k < w.size(); k++) {
      String a = w.get(k);
      switch (a) {
        case "-s", "-sS", "-i" -> {}
        case "-X" -> method = w.get(++k);
        case "-H" -> {
          String[] h = w.get(++k).split(":\\s*", 2);
          request.header(h[0], h[1]);
        }
        case "-d", "--data", "--data-binary" -> {
          body = w.get(++k);
          if (body.startsWith("@")) {
            body = files.get(body.substring(1));
            if (body == null) {
              return null;
            }
          }
        }
        default -> {
          if (a.startsWith("http://localhost:8080")) {
            url = a.replace("http://localhost:8080", "http://localhost:" + port);
          } else {
            fail("unknown curl argument in the README: " + a);
          }
        }
      }
    }
    if (method == null) {
      method = body == null ? "GET" : "POST";
    }
    request
        .uri(URI.create(url))
        .method(
            method,
            body == null
                ? HttpRequest.BodyPublishers.noBody()
                : HttpRequest.BodyPublishers.ofString(body));
    HttpResponse<String> response =
        CLIENT.send(request.build(), HttpResponse.BodyHandlers.ofString());
    return check(e.shown(), response);
  }

  private static String check(String shown, HttpResponse<String> response) {
    List<String> problems = new ArrayList<>();
    int expectedStatus = 0;
    JsonNode actual = null;
    if (shown != null) {
      Matcher status = Pattern.compile("\"status\"\\s*:\\s*(\\d{3})").matcher(shown);
      if (status.find()) {
        expectedStatus = Integer.parseInt(status.group(1));
      }
      try {
        actual = JSON.readTree(response.body());
      } catch (RuntimeException notJson) {
        return "answered " + response.statusCode() + " with no JSON: " + response.body();
      }
    }
    boolean statusOk =
        expectedStatus == 0
            ? response.statusCode() / 100 == 2
            : response.statusCode() == expectedStatus;
    if (!statusOk) {
      return "answered " + response.statusCode() + ": " + response.body();
    }
    if (shown == null) {
      return "";
    }
    Matcher f = FIELD.matcher(shown);
    while (f.find()) {
      String name = f.group(1);
      String value = f.group(2);
      List<JsonNode> found = actual.findValues(name);
      if (found.isEmpty()) {
        problems.add(name + " missing");
      } else if (found.stream().noneMatch(n -> matches(value, n))) {
        problems.add(name + ": shown " + value + ", answered " + found);
      }
    }
    return String.join("; ", problems);
  }

  private static boolean matches(String shown, JsonNode actual) {
    if (shown.startsWith("\"")) {
      String text =
          JSON.readTree(shown.endsWith("...\"") ? shown.replace("...\"", "\"") : shown).asString();
      return shown.endsWith("...\"")
          ? actual.isString() && actual.asString().startsWith(text)
          : actual.isString() && actual.asString().equals(text);
    }
    if (shown.equals("true") || shown.equals("false")) {
      return actual.isBoolean() && actual.asBoolean() == Boolean.parseBoolean(shown);
    }
    String digits = shown.endsWith("...") ? shown.substring(0, shown.length() - 3) : shown;
    if (!actual.isNumber()) {
      return false;
    }
    int decimals = digits.contains(".") ? digits.length() - digits.indexOf('.') - 1 : 0;
    double unit = Math.pow(10, -decimals);
    // agrees to the digits shown: rounded or cut off there
    return Math.abs(actual.asDouble() - Double.parseDouble(digits)) < unit;
  }
}

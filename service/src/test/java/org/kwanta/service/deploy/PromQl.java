package org.kwanta.service.deploy;

import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Finds the metric names a PromQL expression reads. Enough for the project's own rules and
 * dashboards: label matchers, ranges, strings, grouping clauses, function names and keywords are
 * not metric names; Grafana's {@code label_values(metric, label)} reads only {@code metric}.
 */
final class PromQl {

  private static final Pattern IDENTIFIER = Pattern.compile("[a-zA-Z_:][a-zA-Z0-9_:]*");
  private static final Set<String> KEYWORDS =
      Set.of(
          "and",
          "or",
          "unless",
          "by",
          "without",
          "on",
          "ignoring",
          "group_left",
          "group_right",
          "offset",
          "bool",
          "inf",
          "nan");

  private PromQl() {}

  static Set<String> metricNames(String expr) {
    String s = expr.replaceAll("label_values\\(\\s*([a-zA-Z_:][a-zA-Z0-9_:]*)[^)]*\\)", "$1");
    s = s.replaceAll("\"(?:[^\"\\\\]|\\\\.)*\"", " ");
    s = s.replaceAll("\\{[^}]*}", " ");
    s = s.replaceAll("\\[[^]]*]", " ");
    s = s.replaceAll("\\b(by|without|on|ignoring|group_left|group_right)\\s*\\([^)]*\\)", " ");
    s = s.replaceAll("\\$[a-zA-Z_]+", " ");
    Set<String> names = new TreeSet<>();
    Matcher m = IDENTIFIER.matcher(s);
    while (m.find()) {
      String word = m.group();
      int next = m.end();
      while (next < s.length() && Character.isWhitespace(s.charAt(next))) {
        next++;
      }
      boolean function = next < s.length() && s.charAt(next) == '(';
      boolean partOfNumber = m.start() > 0 && Character.isDigit(s.charAt(m.start() - 1));
      if (!function && !partOfNumber && !KEYWORDS.contains(word.toLowerCase())) {
        names.add(word);
      }
    }
    return names;
  }
}

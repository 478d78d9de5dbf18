package org.kwanta.service.support;

import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * Which daily partitions of {@code reading} and {@code evaluation} a query's plan touches, read
 * from PostgreSQL's {@code EXPLAIN} with the query's own parameters (a custom plan, so the planner
 * prunes by the values as the service's prepared statements are planned).
 */
public final class QueryPlans {

  private static final Pattern PARTITION = Pattern.compile("\\b(reading|evaluation)_p\\d{8}\\b");

  private QueryPlans() {}

  /** The plan's lines. */
  public static List<String> explain(JdbcTemplate jdbc, String sql, Object... args) {
    return jdbc.queryForList("EXPLAIN " + sql, String.class, args);
  }

  /** Per table (reading, evaluation), the names of its partitions the plan names. */
  public static Map<String, Set<String>> partitions(List<String> plan) {
    Map<String, Set<String>> out = new TreeMap<>();
    out.put("reading", new TreeSet<>());
    out.put("evaluation", new TreeSet<>());
    for (String line : plan) {
      Matcher m = PARTITION.matcher(line);
      while (m.find()) {
        out.get(m.group(1)).add(m.group());
      }
    }
    return out;
  }

  /** The days from {@code back} days before today (UTC) to {@code ahead} days after it. */
  public static List<LocalDate> days(int back, int ahead) {
    LocalDate today = LocalDate.now(ZoneOffset.UTC);
    List<LocalDate> days = new ArrayList<>();
    for (int i = -back; i <= ahead; i++) {
      days.add(today.plusDays(i));
    }
    return days;
  }

  /** How many partitions the table has now. */
  public static int count(JdbcTemplate jdbc, String table) {
    return jdbc.queryForObject(
        "SELECT count(*) FROM pg_inherits WHERE inhparent = ?::regclass", Integer.class, table);
  }
}

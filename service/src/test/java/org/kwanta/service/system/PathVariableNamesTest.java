package org.kwanta.service.system;

import static org.assertj.core.api.Assertions.assertThat;

import java.lang.reflect.Method;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.config.BeanDefinition;
import org.springframework.context.annotation.ClassPathScanningCandidateComponentProvider;
import org.springframework.core.annotation.AnnotatedElementUtils;
import org.springframework.core.type.filter.AnnotationTypeFilter;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RestController;

/**
 * Issue 18 item 4: every path variable of every controller is named for what it holds, in the words
 * of docs/names.md ({@code {samplePoint}}, {@code {event}}, {@code {key}}, ...), never a bare
 * {@code {id}}. Reads the mappings by reflection, without a Spring context.
 */
class PathVariableNamesTest {

  private static final Pattern VARIABLE = Pattern.compile("\\{([A-Za-z]+)(?::[^}]*)?}");

  private static Set<String> pathVariables() throws Exception {
    ClassPathScanningCandidateComponentProvider scanner =
        new ClassPathScanningCandidateComponentProvider(false);
    scanner.addIncludeFilter(new AnnotationTypeFilter(RestController.class));
    Set<String> variables = new TreeSet<>();
    for (BeanDefinition bean : scanner.findCandidateComponents("org.kwanta.service")) {
      Class<?> type = Class.forName(bean.getBeanClassName());
      List<String> prefixes = new ArrayList<>(List.of(""));
      RequestMapping onType =
          AnnotatedElementUtils.findMergedAnnotation(type, RequestMapping.class);
      if (onType != null && onType.path().length > 0) {
        prefixes = List.of(onType.path());
      }
      List<String> paths = new ArrayList<>(prefixes);
      for (Method method : type.getDeclaredMethods()) {
        RequestMapping onMethod =
            AnnotatedElementUtils.findMergedAnnotation(method, RequestMapping.class);
        if (onMethod != null) {
          paths.addAll(List.of(onMethod.path()));
        }
      }
      for (String path : paths) {
        Matcher m = VARIABLE.matcher(path);
        while (m.find()) {
          variables.add(m.group(1));
        }
      }
    }
    return variables;
  }

  @Test
  void pathVariablesAreTheWordsOfTheNamesDocNeverABareId() throws Exception {
    Set<String> variables = pathVariables();
    assertThat(variables)
        .doesNotContain("id")
        .contains("plant", "block", "samplePoint", "parameter", "event", "key");
    String names =
        Files.readString(Path.of("..").toAbsolutePath().normalize().resolve("docs/names.md"));
    for (String v : variables) {
      assertThat(names)
          .as("docs/names.md names the path variable {" + v + "}")
          .contains("{" + v + "}");
    }
  }
}

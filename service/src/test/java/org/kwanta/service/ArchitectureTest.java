package org.kwanta.service;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.classes;
import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import org.junit.jupiter.api.Test;
import org.springframework.web.bind.annotation.RestController;

class ArchitectureTest {

  static final JavaClasses SERVICE =
      new ClassFileImporter()
          .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
          .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_JARS)
          .importPackages("org.kwanta.service");

  @Test
  void usesJackson3NotJackson2Databind() {
    // Jackson 2 is still on the classpath through other libraries; the application's mapper is
    // Jackson 3.
    noClasses()
        .should()
        .dependOnClassesThat()
        .resideInAPackage("com.fasterxml.jackson.databind..")
        .check(SERVICE);
  }

  @Test
  void controllersArePackagePrivate() {
    classes().that().areAnnotatedWith(RestController.class).should().notBePublic().check(SERVICE);
  }
}

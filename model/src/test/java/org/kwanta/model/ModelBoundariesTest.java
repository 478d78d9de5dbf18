package org.kwanta.model;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import org.junit.jupiter.api.Test;

/**
 * The engine is pure: no framework and no I/O. The Maven enforcer rule in model/pom.xml bans the
 * dependencies; this test bans the imports, including JDK I/O packages the enforcer cannot see.
 */
class ModelBoundariesTest {

  private static final JavaClasses MODEL =
      new ClassFileImporter()
          .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
          .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_JARS)
          .importPackages("org.kwanta.model");

  @Test
  void modelUsesNoFrameworkAndNoIo() {
    noClasses()
        .should()
        .dependOnClassesThat()
        .resideInAnyPackage(
            "org.springframework..",
            "com.fasterxml.jackson..",
            "tools.jackson..",
            "jakarta..",
            "javax.servlet..",
            "java.sql..",
            "javax.sql..",
            "java.io..",
            "java.nio.file..",
            "java.net..",
            "org.slf4j..")
        .because("kwanta-model is a pure-Java engine with no I/O")
        .check(MODEL);
  }
}

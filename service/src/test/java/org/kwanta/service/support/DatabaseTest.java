package org.kwanta.service.support;

import java.lang.annotation.ElementType;
import java.lang.annotation.Retention;
import java.lang.annotation.RetentionPolicy;
import java.lang.annotation.Target;
import org.springframework.boot.micrometer.metrics.test.autoconfigure.AutoConfigureMetrics;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.test.context.ContextConfiguration;

/**
 * A full application test on a random port against the real test PostgreSQL ({@link TestDatabase}),
 * with the Prometheus registry on. Name such classes {@code *IT}: they run in the {@code
 * integration-test} phase.
 */
@Target(ElementType.TYPE)
@Retention(RetentionPolicy.RUNTIME)
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@ContextConfiguration(initializers = TestDatabase.Initializer.class)
@AutoConfigureMetrics
public @interface DatabaseTest {}

package org.kwanta.service;

import org.springframework.boot.SpringApplication;
import org.springframework.boot.autoconfigure.SpringBootApplication;
import org.springframework.boot.context.properties.ConfigurationPropertiesScan;

/** Kwanta: steam-cycle chemistry service. */
@SpringBootApplication
@ConfigurationPropertiesScan
public class KwantaApplication {

  public static void main(String[] args) {
    SpringApplication.run(KwantaApplication.class, args);
  }
}

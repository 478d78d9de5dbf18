package org.kwanta.service.water;

import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import org.junit.jupiter.api.Test;
import org.kwanta.service.system.DatabaseOutage;
import org.kwanta.service.system.HttpLimitsProperties;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.context.properties.EnableConfigurationProperties;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.boot.webmvc.test.autoconfigure.WebMvcTest;
import org.springframework.context.annotation.Import;
import org.springframework.http.MediaType;
import org.springframework.test.web.servlet.MockMvc;

/**
 * Request validation and problem mapping of the water endpoint in a web slice: no database, no
 * server, no security filters (those are covered by the database tests), a second or so.
 */
@WebMvcTest(WaterController.class)
@AutoConfigureMockMvc(addFilters = false)
@EnableConfigurationProperties({WaterProperties.class, HttpLimitsProperties.class})
@Import(DatabaseOutage.class)
class WaterControllerSliceTest {

  @Autowired MockMvc mvc;

  @Test
  void answersWithinTheValidityRange() throws Exception {
    mvc.perform(get("/api/v1/water").param("temperatureCel", "25").param("pressureMPa", "0.1"))
        .andExpect(status().isOk());
  }

  @Test
  void temperatureAboveTheRangeIsA422NamingTheLimit() throws Exception {
    mvc.perform(get("/api/v1/water").param("temperatureCel", "2500").param("pressureMPa", "1"))
        .andExpect(status().isUnprocessableContent())
        .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
        .andExpect(jsonPath("$.limit.quantity").exists());
  }

  @Test
  void aMalformedNumberIsA400Problem() throws Exception {
    mvc.perform(get("/api/v1/water").param("temperatureCel", "warm"))
        .andExpect(status().isBadRequest())
        .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON));
  }
}

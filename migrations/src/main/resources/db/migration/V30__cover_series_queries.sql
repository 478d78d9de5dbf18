-- Series queries read thousands of rows of one sample point and parameter spread over many heap pages (rows
-- arrive in time order across all points). Carrying the values in the primary-key indexes lets them be
-- answered by index-only scans.
ALTER TABLE reading DROP CONSTRAINT reading_pkey;
ALTER TABLE reading ADD PRIMARY KEY (sample_point_id, parameter, time) INCLUDE (value, quality);

ALTER TABLE evaluation DROP CONSTRAINT evaluation_pkey;
ALTER TABLE evaluation ADD PRIMARY KEY (sample_point_id, time)
    INCLUDE (specific_conductivity_25, cation_conductivity_25, degassed_cation_conductivity_25, calculated_ph_25,
             ph_at_temperature, ph_at_temperature_low, ph_at_temperature_high, neutral_ph_at_temperature);

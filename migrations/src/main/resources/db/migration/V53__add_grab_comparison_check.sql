-- Online vs grab (issue 14 item 2): a grab or lab result compared with the online instrument at the same point
-- is logged in the instrument's history as a check of kind GRAB_COMPARISON: PASSED within tolerance (clears a
-- doubt on the instrument), FAILED outside (confirms it).

ALTER TABLE instrument_check DROP CONSTRAINT instrument_check_kind_check;
ALTER TABLE instrument_check ADD CONSTRAINT instrument_check_kind_check
    CHECK (kind IN ('CELL_CONSTANT_CHECK', 'BUFFER_CALIBRATION', 'SODIUM_CALIBRATION', 'CATION_RESIN_CHANGE',
                    'DISSOLVED_OXYGEN_ZERO_SPAN', 'GRAB_COMPARISON'));

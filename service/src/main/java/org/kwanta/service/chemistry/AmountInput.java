package org.kwanta.service.chemistry;

import io.swagger.v3.oas.annotations.media.Schema;

/**
 * One component's total as sent by a client.
 *
 * @param component component name, e.g. {@code ammonia}, {@code chloride}, {@code carbon_dioxide}
 * @param amount the total in {@code unit}
 * @param unit UCUM code: {@code mg/kg}, {@code ug/kg}, {@code mol/kg}, {@code mmol/kg} or {@code
 *     umol/kg} (mass units count the component as the formula listed in the response)
 */
@Schema(description = "Total of one component, with its unit")
record AmountInput(
    @Schema(example = "ammonia", requiredMode = Schema.RequiredMode.REQUIRED) String component,
    @Schema(example = "0.8", requiredMode = Schema.RequiredMode.REQUIRED) Double amount,
    @Schema(
            example = "mg/kg",
            allowableValues = {"mg/kg", "ug/kg", "mol/kg", "mmol/kg", "umol/kg"},
            requiredMode = Schema.RequiredMode.REQUIRED)
        String unit) {}

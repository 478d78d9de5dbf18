package org.kwanta.service.ingest;

import org.springframework.boot.context.properties.ConfigurationProperties;

/**
 * Engine options of the evaluation of ingested readings ({@code kwanta.evaluation.*}).
 *
 * @param amineDistributionEstimates whether an amine-dosed steam point gets a pH at temperature
 *     from the amines' estimated vapour–liquid distribution constants (order-of-magnitude values
 *     recalled from memory, about a factor of two; {@code water.AmineDistribution}). Default false:
 *     the project's reference notes say not to ship them as defaults without the primary data, so
 *     such a point gets no pH at temperature and a note saying why and how to opt in.
 */
@ConfigurationProperties("kwanta.evaluation")
public record EvaluationProperties(boolean amineDistributionEstimates) {}

package org.kwanta.service.ingest;

import java.util.List;

/** A batch of readings, stored whole or not at all. */
public record IngestRequest(List<ReadingInput> readings) {}

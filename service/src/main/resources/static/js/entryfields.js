// The JSON fields and API paths of entry (lab and grab results, a block's operating state) and of the
// lab markers on the trend, beside fields.js: a renamed field is one edit here.
'use strict';

const enc = encodeURIComponent;

export const paths = {
  plant: (plant) => 'api/v1/plants/' + enc(plant),
  labResults: () => 'api/v1/lab-results',
  pointLabResults: (point, q) => 'api/v1/sample-points/' + enc(point) + '/lab-results?' + new URLSearchParams(q),
  blockStates: (plant, block) => 'api/v1/plants/' + enc(plant) + '/blocks/' + enc(block) + '/operating-states',
};

/** GET /caller: entry (lab results, operating states, limits, event notes) is for chemist and admin keys. */
export const mayEnter = (caller) => !!(caller && caller.acknowledge);

/** GET /plants/{plant}: the plant's blocks and which block each sample point is in. */
export function plantBlocks(j) {
  return {
    blocks: (j.blocks || []).map((b) => ({ id: b.id, name: b.name })),
    points: (j.samplePoints || []).map((p) => ({ id: p.id, block: p.block, name: p.name, parameters: p.parameters || [] })),
  };
}

/** The body of POST /lab-results: one grab or lab result. */
export function labBody(r) {
  const reading = { samplePoint: r.point, parameter: r.parameter, time: r.time, value: r.value, unit: r.unit, source: r.source };
  if (r.below) reading.censored = 'below';
  if (r.sampleId) reading.sampleId = r.sampleId;
  if (r.method) reading.labMethod = r.method;
  if (r.densityTemperatureCel !== null && r.densityTemperatureCel !== undefined) reading.densityTemperatureCel = r.densityTemperatureCel;
  return { readings: [reading] };
}

/** The answer of POST /lab-results. */
export const labOutcome = (j) => ({
  inserted: j.inserted, corrected: j.corrected, unchanged: j.unchanged,
  conversions: (j.conversions || []).length,
});

/** One grab or lab result: from the series API's labResults, or GET /sample-points/{samplePoint}/lab-results. */
export const labPoint = (x) => ({
  t: Date.parse(x.time) / 1000, source: x.source, value: x.value, below: x.censored === 'below', sampleId: x.sampleId || null,
});

/** The body of POST .../operating-states. */
export const blockStateBody = (state, since, note) => (note ? { state, since, note } : { state, since });

/** GET .../operating-states: the block's recorded entries, newest first, and its state now. */
export function blockStates(j) {
  const entries = (j.entries || []).map((e) => ({ state: e.state, since: e.since, note: e.note, at: e.recordedAt, by: e.recordedBy }));
  entries.sort((a, b) => Date.parse(b.since) - Date.parse(a.since) || Date.parse(b.at) - Date.parse(a.at));
  const spans = j.timeline || [];
  return { entries, now: spans.length ? spans[spans.length - 1].state : null };
}

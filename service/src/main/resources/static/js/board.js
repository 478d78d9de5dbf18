// The plant board: every sample point, most urgent first, with its worst level, instrument doubt,
// the diagnosis in plain words, pH at temperature with band and neutral pH, and each value's age.
'use strict';
import { el, fmt, sig, age, unit, parameterShort, parameterName, regimeName, words } from './dom.js';
import { badge, rank, CODE, STALE } from './levels.js';

/** What a finding means, in plain words (codes: docs/diagnosis.md, docs/conductivity-and-checks.md). */
const PLAIN = {
  COOLING_WATER_INGRESS: 'Cooling water is getting in: a condenser leak',
  CONTAMINANT_INGRESS: 'Contamination is getting in (no sodium rise here to name its source)',
  CARBON_DIOXIDE_INGRESS: 'Carbon dioxide is getting in: air in-leakage',
  CATION_COLUMN_EXHAUSTED: 'The cation column is exhausted: the reading is not the water',
  SODIUM_WITHOUT_CATION_RISE: 'The sodium analyser reads high alone: check it',
  DOSING_CHANGE: 'The alkalizer dose changed',
  PH_ELECTRODE_DRIFT: 'The pH electrode is drifting: check it',
  PH_ELECTRODE_STEP: 'The pH electrode jumped: check it',
  SPECIFIC_CONDUCTIVITY_DRIFT: 'The specific conductivity cell is drifting: check it',
  SPECIFIC_CONDUCTIVITY_STEP: 'The specific conductivity cell jumped: check it',
  PH_MEASURED_VS_CALCULATED: 'Measured and calculated pH disagree',
  CATION_ABOVE_SPECIFIC: 'Cation conductivity above specific conductivity: an instrument is wrong',
  SPECIFIC_BELOW_PHYSICAL_BOUND: 'Specific conductivity impossibly low: check the cell',
  DEGASSED_ABOVE_CATION: 'Degassed above cation conductivity: an instrument is wrong',
  BELOW_PURE_WATER: 'A conductivity reads below pure water: check the cell',
  FLATLINE: 'A reading has not changed for an hour: check the analyser',
  OUT_OF_RANGE: 'A reading is missing or at its range limit',
  SAMPLE_TEMPERATURE_OUT_OF_BAND: 'Sample temperature outside 25 ± 2 °C: check the sample cooler',
  SAMPLE_TEMPERATURE_OUTSIDE_MODEL: 'Sample temperature outside 0–100 °C: values not compensated',
};
export const plain = (code) => PLAIN[code] || words(code);
export const pointsAtWords = (p) => p === 'process' ? 'the process' : p === 'sample_conditioning' ? 'the sample conditioning' : 'the ' + parameterName(p) + ' instrument';

/** Urgency: worst level first, then a process finding, an instrument finding, staleness. */
export function urgency(p) {
  const worst = Math.max(0, ...p.levels.map((l) => rank(l.level)));
  const process = p.findings.some((f) => f.pointsAt === 'process');
  const instrument = p.findings.length > 0 && !process;
  const doubt = p.levels.some((l) => l.inDoubt);
  const stale = !p.evaluated || p.evaluated.ageSeconds > 900;
  return worst * 100 + (process ? 50 : 0) + (instrument || doubt ? 20 : 0) + (stale ? 5 : 0);
}

export function worstLevel(p) {
  return p.levels.reduce((w, l) => (rank(l.level) > rank(w.level) || (rank(l.level) === rank(w.level) && l.inDoubt && !w.inDoubt)) ? l : w,
    { level: 'NORMAL', inDoubt: false, parameter: null });
}

function levelCell(p) {
  if (p.levels.length === 0) return el('span', { class: 'muted' }, 'no limits');
  const worst = worstLevel(p);
  const notable = p.levels.filter((l) => l.level !== 'NORMAL' || l.inDoubt).sort((a, b) => rank(b.level) - rank(a.level));
  return el('div', { class: 'levels' },
    badge(worst.level, worst.inDoubt),
    notable.length ? el('ul', { class: 'plain' }, notable.map((l) => el('li', {},
      el('span', { class: 'glyph-inline', 'aria-hidden': 'true' }, CODE[l.level].glyph), ' ',
      parameterShort(l.parameter) + ' ' + CODE[l.level].word + ' at ' + sig(l.value) + ' ' + unit(l.unit)
        + (l.calculated ? ' (calculated pH)' : '') + (l.inDoubt ? ' — instrument in doubt' : '') + ', since ' + age((Date.now() - Date.parse(l.since)) / 1000)))) : null);
}

function diagnosisCell(p) {
  if (!p.evaluated) return el('span', { class: 'muted' }, 'no evaluation yet');
  if (p.findings.length === 0) return el('span', { class: 'quiet' }, 'Nothing found: the channels agree with each other and their baselines');
  return el('ul', { class: 'plain findings' }, p.findings.map((f) => el('li', { class: f.pointsAt === 'process' ? 'process' : 'instrument' },
    el('strong', {}, plain(f.code)), el('br'),
    origin(f) ? el('small', {}, origin(f)) : null, origin(f) ? el('br') : null,
    el('small', {}, 'points at ' + pointsAtWords(f.pointsAt) + (f.instant ? ' (instant check)' : '') + ' · ' + f.code))));
}

/** Where a process finding says the change first appeared along the cycle (docs/diagnosis.md). */
function origin(f) {
  const m = /first seen upstream at ([^\s,.(]+)(?: \(([^)]*)\))?/.exec(f.explanation || '');
  return m ? 'first seen upstream at ' + m[1] + (m[2] ? ' (' + m[2] + ')' : '') : null;
}

function phCell(p) {
  const t = p.phAtT;
  if (!t) return el('span', { class: 'muted' }, '–');
  return el('div', {},
    el('span', { class: 'big' }, fmt(t.ph, 2)), ' ',
    el('span', {}, 'at ' + fmt(t.temperatureCel, 0) + ' °C'), el('br'),
    el('small', {}, 'band ' + fmt(t.low, 2) + '–' + fmt(t.high, 2) + ' · neutral ' + fmt(t.neutral, 2)),
    el('br'), el('small', { class: 'muted' }, 'evaluated ' + age(p.evaluated && p.evaluated.ageSeconds) + ' ago'));
}

function valuesCell(p) {
  const items = [];
  const reading = (code) => p.readings.find((r) => r.parameter === code);
  const add = (label, value, u, ageSeconds, title) => items.push(el('div', { class: 'val' + (ageSeconds > 900 ? ' old' : '') },
    el('dt', {}, label), el('dd', {}, value + ' ' + u, ' ', el('small', { class: 'age' }, age(ageSeconds)))));
  const evAge = p.evaluated ? p.evaluated.ageSeconds : null;
  if (p.at25.sc !== null) add('SC₂₅', sig(p.at25.sc), 'µS/cm', evAge);
  if (p.at25.cace !== null) add('CACE₂₅', sig(p.at25.cace), 'µS/cm', evAge);
  if (p.at25.dcace !== null) add('DCACE₂₅', sig(p.at25.dcace), 'µS/cm', evAge);
  const ph = reading('ph');
  if (ph) add('pH₂₅', fmt(ph.value, 2), '', ph.ageSeconds);
  if (p.calculatedPh !== null && p.at25.sc !== null && p.at25.cace !== null) add('pH₂₅ calc.', fmt(p.calculatedPh, 2), '', evAge);
  for (const code of ['sodium', 'dissolved_oxygen', 'silica', 'iron']) {
    const r = reading(code);
    if (r) add(parameterShort(code), sig(r.value), unit(r.unit), r.ageSeconds);
  }
  return items.length ? el('dl', { class: 'values' }, items) : el('span', { class: 'muted' }, 'no readings');
}

/** The board rows (a table; CSS turns each row into a card on a narrow screen). */
export function rows(points, open) {
  return points.slice().sort((a, b) => urgency(b) - urgency(a) || a.id.localeCompare(b.id)).map((p) => {
    const stale = !p.evaluated || p.evaluated.ageSeconds > 900;
    return el('tr', { 'data-point': p.id, class: stale ? 'stale' : null },
      el('th', { scope: 'row', 'data-label': 'Sample point' },
        el('button', { type: 'button', class: 'point', onclick: () => open(p), 'aria-label': 'Open ' + p.id + ', ' + p.name },
          p.id), stale ? el('span', { class: 'stale-mark', title: STALE.say, 'aria-label': STALE.say }, ' ' + STALE.glyph) : null,
        el('br'), el('span', { class: 'name' }, p.name), el('br'),
        el('small', { class: 'muted' }, words(p.location) + ' · ' + regimeName(p.regime))),
      el('td', { 'data-label': 'Level' }, levelCell(p)),
      el('td', { 'data-label': 'Diagnosis' }, diagnosisCell(p)),
      el('td', { 'data-label': 'pH at T' }, phCell(p)),
      el('td', { 'data-label': 'Values' }, valuesCell(p)));
  });
}

/** One line over the board: how many points at each level. */
export function summary(points) {
  const counts = {};
  for (const p of points) {
    const w = worstLevel(p);
    counts[w.level] = (counts[w.level] || 0) + 1;
  }
  const doubt = points.filter((p) => p.levels.some((l) => l.inDoubt)).length;
  const process = points.filter((p) => p.findings.some((f) => f.pointsAt === 'process')).length;
  const parts = Object.keys(CODE).filter((l) => counts[l]).reverse().map((l) => counts[l] + ' ' + CODE[l].word);
  return points.length + (points.length === 1 ? ' sample point: ' : ' sample points: ') + parts.join(', ') + (doubt ? '; ' + doubt + ' with an instrument in doubt' : '')
    + (process ? '; ' + process + ' with a finding in the process' : '') + '.';
}

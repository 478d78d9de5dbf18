// One sample point: its findings now and in the last 24 h, the trend, the pH-at-temperature curve
// with the what-if panel, and the limits in force with the change form (for roles that may).
'use strict';
import * as F from './fields.js';
import * as api from './api.js';
import { $, el, fmt, sig, when, unit, parameterName } from './dom.js';
import { plain, pointsAtWords } from './board.js';
import * as trend from './trend.js';
import * as curve from './curve.js';
import * as limits from './limits.js';

let current = null;

function findings(p) {
  const now = p.findings.length
    ? p.findings.map((f) => el('li', {}, el('strong', {}, plain(f.code)), ' — points at ' + pointsAtWords(f.pointsAt)
      + (f.instant ? ' (instant check)' : '') + '. ', f.explanation,
      f.evidence ? el('br') : null,
      f.evidence ? el('small', {}, f.evidence.quantity + ': expected ' + sig(f.evidence.expected) + ', read ' + sig(f.evidence.read)
        + ', residual ' + sig(f.evidence.residual) + ', tolerance ±' + sig(f.evidence.tolerance) + ' ' + unit(f.evidence.unit) + ' · ' + f.code) : null))
    : [el('li', {}, 'No finding now: the channels agree with each other, their baselines and the neighbouring points.')];
  return [el('h3', {}, 'Diagnosis now'), el('ul', { id: 'findings' }, now), el('h3', {}, 'Findings in the last 24 h'), el('ul', { id: 'history' }, el('li', {}, 'loading…'))];
}

async function findingHistory(p) {
  try {
    const minutes = F.findingMinutes(await api.get(F.paths.findings(p.id)));
    const spans = [];
    for (const m of minutes) {
      const k = m.findings.map((f) => plain(f.code) + ' (' + f.code + ')').join('; ');
      const last = spans[spans.length - 1];
      if (last && last.key === k && Date.parse(m.time) - Date.parse(last.to) <= 5 * 60000) last.to = m.time;
      else spans.push({ key: k, from: m.time, to: m.time });
    }
    $('history').replaceChildren(...(spans.length
      ? spans.reverse().map((s) => el('li', {}, when(s.from) + ' – ' + when(s.to) + ': ' + s.key))
      : [el('li', {}, 'No finding in the last 24 h.')]));
  } catch (e) {
    $('history').replaceChildren(el('li', {}, 'Could not load the findings (' + e.message + ').'));
  }
}

// The band's parts as "(a) instrument tolerances −0.01/+0.01, ..." (pH units), or nothing for rows
// stored before the itemised uncertainty.
function bandParts(u) {
  if (!u) return '';
  const parts = [u.instrumentTolerances, u.constantSetSpread, u.estimatedConstants, u.operatingConditions]
    .filter((x) => x)
    .map((x) => x.label + ' −' + fmt(x.belowPh, 3) + '/+' + fmt(x.abovePh, 3));
  return ' Band parts (pH): ' + parts.join('; ') + '; combined by root-sum-square.';
}

export async function open(p, caller, status) {
  current = { p, caller, status };
  $('detail-title').textContent = p.id + ' – ' + p.name;
  $('detail-findings').replaceChildren(...findings(p));
  $('provenance').textContent = p.phAtT
    ? 'pH at ' + fmt(p.phAtT.temperatureCel, 0) + ' °C and ' + fmt(p.phAtT.pressureMPa, 2) + ' MPa: ' + p.phAtT.formulation + '.' + bandParts(p.phAtT.uncertainty) + ' Configuration version ' + p.configVersion + '.'
    : '';
  findingHistory(p);
  let config;
  try {
    config = F.samplePoint(await api.get(F.paths.samplePoint(p.id)));
  } catch (e) {
    status('Could not load the sample point (' + e.message + ').');
    return;
  }
  current.config = config;
  await Promise.all([
    trend.open(p, config, status),
    curve.open(p, config, status),
    limits.open(p, caller, status),
  ]);
  document.body.dataset.detail = p.id;
}

/** Times are shown in another zone: draw again. */
export function redraw() {
  if (current && current.config) trend.redraw();
}

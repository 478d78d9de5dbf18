// Entry, for chemist and admin keys (the API enforces the same): a grab or lab result, and the
// operating state a plant block entered. Limit changes live with the point's limits, event notes with
// the events; this section points at them. A read key sees why there is nothing to fill in.
'use strict';
import * as E from './entryfields.js';
import * as api from './api.js';
import { $, el, when, parameterName, unit } from './dom.js';
import * as T from './timeinput.js';

/** Parameters a lab or a grab sample reports, in the order a chemist looks for them. */
const LAB_PARAMETERS = ['cation_conductivity', 'specific_conductivity', 'degassed_cation_conductivity', 'ph', 'sodium', 'chloride',
  'sulfate', 'silica', 'iron', 'copper', 'phosphate', 'dissolved_oxygen', 'ammonia', 'toc', 'acetate', 'formate'];
/** Units the lab-results API takes per parameter (UCUM); ug/L and mg/L are converted with the density of water. */
const unitsOf = (p) => p.endsWith('conductivity') ? ['uS/cm', 'mS/m'] : p === 'ph' ? ['[pH]'] : ['ug/kg', 'mg/kg', 'ug/L', 'mg/L'];
const STATES = [['IN_SERVICE', 'in service'], ['START_UP', 'start-up'], ['SHUT_DOWN', 'shut down'], ['LAYUP_WET', 'wet layup'], ['LAYUP_DRY', 'dry layup']];
const stateWord = (s) => (STATES.find((x) => x[0] === s) || [s, s ? String(s).toLowerCase() : 'not recorded (counted as in service)'])[1];

let ctx = { plant: null, caller: null, status: () => {}, onLab: () => {}, blocks: null };

const field = (label, control, cls) => el('label', { class: cls }, label, control);

function labForm() {
  const parameter = el('select', { id: 'lab-parameter', required: true }, LAB_PARAMETERS.map((p) => el('option', { value: p }, parameterName(p))));
  const unitSelect = el('select', { id: 'lab-unit' });
  const fillUnits = () => unitSelect.replaceChildren(...unitsOf(parameter.value).map((u) => el('option', { value: u }, unit(u))));
  parameter.addEventListener('change', fillUnits);
  fillUnits();
  const form = el('form', { id: 'lab-form', class: 'controls entry', 'aria-label': 'Enter a grab or lab result', onsubmit: submitLab },
    el('fieldset', {},
      el('legend', {}, 'A grab or lab result'),
      field('Sample point', el('select', { id: 'lab-point', required: true })),
      field('Parameter', parameter),
      field('Kind', el('select', { id: 'lab-source' }, el('option', { value: 'lab' }, 'lab result ●'), el('option', { value: 'grab' }, 'grab sample ◆'))),
      T.field('lab-time', 'Sampled at'),
      field('Value', el('input', { id: 'lab-value', type: 'number', step: 'any', min: '0', required: true, inputmode: 'decimal' }), 'num'),
      field('Unit', unitSelect),
      el('label', { class: 'check' }, el('input', { id: 'lab-below', type: 'checkbox' }), ' below the detection limit (the value is the limit) ▽'),
      field('Sample id', el('input', { id: 'lab-sample', maxlength: '64', autocomplete: 'off' })),
      field('Method', el('input', { id: 'lab-method', maxlength: '200', autocomplete: 'off' }), 'wide'),
      el('button', { type: 'submit' }, 'Store the result'),
      el('p', { class: 'note' }, 'Stored apart from the online readings: never the current online value, drawn on the trend as a marker. '
        + 'Conductivities as the lab reports them (at 25 °C); µg/L and mg/L are converted to µg/kg with the density of water at 25 °C.')));
  return form;
}

function blockForm() {
  return el('form', { id: 'block-form', class: 'controls entry', 'aria-label': 'Record a block operating state', onsubmit: submitBlock },
    el('fieldset', {},
      el('legend', {}, 'The operating state a block entered'),
      field('Block', el('select', { id: 'block-id', required: true, onchange: () => blockHistory() })),
      field('State', el('select', { id: 'block-state' }, STATES.map(([v, w]) => el('option', { value: v }, w)))),
      T.field('block-since', 'Since'),
      field('Note', el('input', { id: 'block-note', maxlength: '2000', autocomplete: 'off' }), 'wide'),
      el('button', { type: 'submit' }, 'Record the state'),
      el('p', { class: 'note' }, 'Appended, never overwritten (a second entry with the same time corrects the first). '
        + 'Only in-service time counts towards excursion hours, hours per level and instrument availability.')));
}

/** Builds the section once; shows or hides the forms for the key's role. */
function build() {
  if ($('lab-form')) return;
  $('entry').replaceChildren(
    el('p', { id: 'entry-readonly', class: 'note', hidden: true },
      'Entry needs a chemist or admin key; this key may read only. The API refuses the same.'),
    labForm(),
    blockForm(),
    el('div', { id: 'block-states', 'aria-live': 'polite' }),
    el('p', { class: 'note', id: 'entry-elsewhere' }, 'Limit changes (from a time on, with a reason): open a point on the board, ',
      el('em', {}, 'Limits in force'), '. Event notes, cause and status: ', el('a', { href: '#events' }, 'Events'), '.'));
}

/** The plant or the key changed: fill the choices (sample points, blocks) again. */
export async function show(plant, caller, points, status, onLab) {
  build();
  const may = E.mayEnter(caller);
  ctx = { ...ctx, caller, status, onLab: onLab || (() => {}) };
  $('entry-readonly').hidden = !caller || may;
  $('lab-form').hidden = !may;
  $('block-form').hidden = !may;
  $('block-states').hidden = !caller;
  document.body.dataset.entry = may ? 'forms' : 'none';
  if (!caller) return;
  const point = $('lab-point');
  const ids = points.map((p) => p.id).join('\n');
  if (point.dataset.ids !== ids) { // rebuilt only when the points change, so an open choice is not disturbed
    const chosen = point.value;
    point.replaceChildren(...points.map((p) => el('option', { value: p.id }, p.id + ' – ' + p.name)));
    if (points.some((p) => p.id === chosen)) point.value = chosen;
    point.dataset.ids = ids;
  }
  T.followNow($('lab-time'));
  T.followNow($('block-since'));
  if (plant === ctx.plant && ctx.blocks) return;
  ctx.plant = plant;
  let blocks = [];
  try {
    blocks = E.plantBlocks(await api.get(E.paths.plant(plant))).blocks;
  } catch (e) {
    status('Could not load the plant\'s blocks (' + e.message + ').');
  }
  // signed out or another plant chosen while the answer was on its way: leave the form to that
  if (ctx.plant !== plant) return;
  ctx.blocks = blocks;
  $('block-id').replaceChildren(...blocks.map((b) => el('option', { value: b.id }, b.id + ' – ' + b.name)));
  T.followNow($('block-since'));
  await blockHistory();
}

export function clear() {
  if (!$('lab-form')) return;
  $('lab-form').hidden = true;
  $('block-form').hidden = true;
  $('entry-readonly').hidden = true;
  $('block-states').replaceChildren();
  ctx.plant = null; ctx.blocks = null;
}

async function blockHistory() {
  const block = $('block-id').value;
  if (!ctx.plant || !block) { $('block-states').replaceChildren(); return; }
  try {
    const s = E.blockStates(await api.get(E.paths.blockStates(ctx.plant, block)));
    $('block-states').replaceChildren(
      el('p', {}, 'Block ', el('strong', {}, block), ' now: ', el('strong', { id: 'block-now' }, stateWord(s.now)), '.'),
      s.entries.length
        ? el('ol', { class: 'history', reversed: true, 'aria-label': 'Recorded states, newest first' }, s.entries.slice(0, 8).map((x) =>
          el('li', {}, stateWord(x.state) + ' since ' + when(x.since) + ' — ' + x.by + ', recorded ' + when(x.at) + (x.note ? ': ' + x.note : ''))))
        : el('p', { class: 'note' }, 'No state recorded for this block yet: its time counts as in service.'));
  } catch (e) {
    $('block-states').replaceChildren(el('p', {}, 'Could not load the block\'s states (' + e.message + ').'));
  }
}

async function submitLab(e) {
  e.preventDefault();
  const sampled = T.read($('lab-time'));
  if (!sampled) { ctx.status('Not stored: the time sampled is not a time (see the message under it).'); return; }
  const r = {
    point: $('lab-point').value, parameter: $('lab-parameter').value, source: $('lab-source').value,
    time: sampled.toISOString(), value: Number($('lab-value').value), unit: $('lab-unit').value,
    below: $('lab-below').checked, sampleId: $('lab-sample').value.trim(), method: $('lab-method').value.trim(),
  };
  try {
    const o = E.labOutcome(await api.post(E.paths.labResults(), E.labBody(r)));
    ctx.status('Stored: ' + (r.source === 'grab' ? 'grab sample' : 'lab result') + ' ' + parameterName(r.parameter) + ' at ' + r.point + ' '
      + (r.below ? '< ' : '') + r.value + ' ' + unit(r.unit) + ', ' + when(r.time)
      + (o.corrected ? ' (corrected an earlier entry)' : o.unchanged ? ' (already stored)' : '') + '.');
    for (const id of ['lab-value', 'lab-sample']) $(id).value = '';
    $('lab-below').checked = false;
    ctx.onLab(r.point);
  } catch (err) {
    ctx.status('Could not store the result (' + err.message + ').');
  }
}

async function submitBlock(e) {
  e.preventDefault();
  const entered = T.read($('block-since'));
  if (!entered) { ctx.status('Not recorded: "since" is not a time (see the message under it).'); return; }
  const block = $('block-id').value, state = $('block-state').value, since = entered.toISOString();
  const note = $('block-note').value.trim();
  try {
    await api.post(E.paths.blockStates(ctx.plant, block), E.blockStateBody(state, since, note));
    ctx.status('Recorded: block ' + block + ' ' + stateWord(state) + ' since ' + when(since) + '.');
    $('block-note').value = '';
    await blockHistory();
  } catch (err) {
    ctx.status('Could not record the state (' + err.message + ').');
  }
}

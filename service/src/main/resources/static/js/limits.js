// Limits in force at a point, and the form that records the plant's own limits from a time on,
// with a reason (chemist and admin keys; a past time only for admin keys, as the API enforces).
'use strict';
import * as F from './fields.js';
import * as api from './api.js';
import { $, el, sig, when, unit, parameterName } from './dom.js';
import * as T from './timeinput.js';
import { badge } from './levels.js';

let ctx = null; // { p, caller, status, now: [profiles] }

function table(now) {
  if (!now.length) return el('p', {}, 'No limits apply at this point.');
  return el('table', { class: 'limits' },
    el('caption', { class: 'sr-only' }, 'Limits in force now'),
    el('thead', {}, el('tr', {}, ['Parameter', 'Normal', 'Action levels', 'Origin'].map((h) => el('th', { scope: 'col' }, h)))),
    el('tbody', {}, now.map((l) => el('tr', {},
      el('th', { scope: 'row', 'data-label': 'Parameter' }, parameterName(l.parameter)),
      el('td', { 'data-label': 'Normal' }, l.normal ? (l.normal.low !== null ? sig(l.normal.low) : '') + ' – ' + (l.normal.high !== null ? sig(l.normal.high) : '') + ' ' + unit(l.unit) : '–'),
      el('td', { 'data-label': 'Action levels' }, l.thresholds.length ? l.thresholds.map((t) => el('span', { class: 'thr' },
        badge(t.level, false), ' ' + (t.side === 'HIGH' ? '> ' : '< ') + sig(t.value) + ' ' + unit(l.unit))) : 'none'),
      el('td', { 'data-label': 'Origin' }, l.origin === 'DEFAULT' ? 'shipped example (not the plant\'s)' : 'plant\'s own, version ' + l.version
        + (l.effectiveFrom ? ' from ' + when(l.effectiveFrom) : ''))))));
}

function numberInput(id, label, value) {
  return el('label', { class: 'num' }, label, el('input', { id, type: 'number', step: 'any', value: value === null || value === undefined ? '' : String(value) }));
}

function fillForm() {
  const l = ctx.now.find((x) => x.parameter === $('limit-parameter').value);
  if (!l) return;
  const u = ' (' + unit(l.unit) + ')';
  $('limit-values').replaceChildren(
    numberInput('limit-normal-low', 'Normal from' + u, l.normal ? l.normal.low : null),
    numberInput('limit-normal-high', 'Normal to' + u, l.normal ? l.normal.high : null),
    ...l.thresholds.map((t, i) => numberInput('limit-thr-' + i, t.level + ' ' + (t.side === 'HIGH' ? 'above' : 'below') + u, t.value)));
}

export async function open(p, caller, status) {
  ctx = { p, caller, status, now: [] };
  try {
    ctx.now = F.limitsNow(await api.get(F.paths.limits(p.id)));
  } catch (e) {
    $('limits').replaceChildren(el('p', {}, 'Could not load the limits (' + e.message + ').'));
    return;
  }
  $('limits').replaceChildren(table(ctx.now));
  const may = caller && caller.setLimits && ctx.now.length > 0;
  $('limit-form').hidden = !may;
  if (!may) return;
  $('limit-parameter').replaceChildren(...ctx.now.map((l) => el('option', { value: l.parameter }, parameterName(l.parameter))));
  fillForm();
  T.reset($('limit-from')); // left as it is: in force from the moment of saving
  $('limit-note').textContent = caller.backdateLimits
    ? 'An admin key may set a past time: that corrects the record and is kept with its reason.'
    : 'From now or a later time (a planned change). Earlier values stay judged by the limits in force then.';
}

$('limit-from-slot').replaceWith(T.field('limit-from', 'In force from'));
$('limit-parameter').addEventListener('change', fillForm);
$('limit-form').addEventListener('submit', async (e) => {
  e.preventDefault();
  const l = ctx.now.find((x) => x.parameter === $('limit-parameter').value);
  const val = (id) => { const s = $(id).value.trim(); return s === '' ? null : Number(s); };
  const reason = $('limit-reason').value.trim();
  // the time left as proposed means now: the API takes the moment of saving
  const from = $('limit-from');
  let effective = null;
  if (from.dataset.edited) {
    const chosen = T.read(from);
    if (!chosen) { ctx.status('Not recorded: "in force from" is not a time (see the message under it).'); return; }
    const thisMinute = T.format(chosen) === T.format(new Date());
    if (!ctx.caller.backdateLimits && !thisMinute && chosen.getTime() < Date.now()) {
      T.showError(from, 'A past time needs an admin key: limits in force from now or later (' + T.format(new Date()) + ' or after).');
      from.focus();
      return;
    }
    effective = thisMinute ? null : chosen.toISOString(); // the minute now: from the moment of saving
  }
  const body = F.limitsBody(l, val('limit-normal-low'), val('limit-normal-high'),
    l.thresholds.map((t, i) => ({ level: t.level, side: t.side, value: val('limit-thr-' + i) })).filter((t) => t.value !== null),
    'plant procedure: ' + reason);
  try {
    await api.put(F.paths.setLimits(ctx.p.id, l.parameter, effective, reason), body);
    $('limit-reason').value = '';
    ctx.status('New limits for ' + parameterName(l.parameter) + ' recorded' + (effective ? ', in force from ' + when(effective) : ', in force now') + '.');
    await open(ctx.p, ctx.caller, ctx.status);
  } catch (err) {
    ctx.status('Could not record the limits (' + err.message + ').');
  }
});

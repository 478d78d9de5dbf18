// Events: the plant's excursions (open ones with their allowance countdown), acknowledgements and
// their history, and the recorded events with cause, status and notes. Forms only for roles that may.
'use strict';
import * as F from './fields.js';
import * as api from './api.js';
import { $, el, fmt, sig, when, duration, unit, parameterName, words } from './dom.js';
import { badge, CODE } from './levels.js';

const CAUSES = ['UNDETERMINED', 'CONDENSER_INGRESS', 'AIR_INGRESS', 'MAKE_UP_WATER', 'CONDENSATE_POLISHING', 'CHEMICAL_DOSING',
  'OPERATING_TRANSIENT', 'INSTRUMENT_OR_SAMPLING', 'OTHER'];
const STATUSES = ['OPEN', 'UNDER_INVESTIGATION', 'CLOSED'];
let seq = 0;
const uid = (p) => p + '-' + (++seq);

/** A form is being filled in: do not rebuild the section under the user's hands. */
function busy() {
  const section = $('events');
  if (section.contains(document.activeElement) && document.activeElement !== section) return true;
  return [...section.querySelectorAll('textarea, input')].some((i) => i.value.trim() !== '');
}

export function clear() {
  answers = { plant: null, excursions: null, events: null };
  $('excursions').replaceChildren();
  $('event-list').replaceChildren();
}

function select(id, values, chosen, blank) {
  return el('select', { id },
    blank ? el('option', { value: '' }, blank) : null,
    values.map((v) => el('option', { value: v, selected: v === chosen }, words(v))));
}

function allowance(x) {
  if (!x.open) return 'ended ' + when(x.end) + ' after ' + duration(x.durationSeconds) + (x.exceeded ? '; allowance was exceeded' : '');
  if (x.exceeded) return 'allowance exceeded (' + duration(x.allowanceSeconds) + ' at ' + x.highest + ')';
  if (x.remainingSeconds === null || x.remainingSeconds === undefined) return 'open';
  return duration(x.remainingSeconds) + ' left of the allowance (until ' + when(x.deadline) + ')';
}

function ackForm(x, reload, status) {
  const id = uid('ack');
  const note = el('textarea', { id, rows: 2, maxlength: 4000, required: true });
  return el('form', { class: 'inline-form', 'aria-label': 'Acknowledge ' + x.point + ' ' + x.parameter, onsubmit: async (e) => {
    e.preventDefault();
    try {
      await api.post(F.paths.acknowledge(), F.acknowledgementBody(x, note.value.trim()));
      note.value = '';
      status('Acknowledged; the note is in the excursion\'s history.');
      await reload();
    } catch (err) { status('Could not acknowledge (' + err.message + ').'); }
  } }, el('label', { for: id }, 'Acknowledgement note'), note, el('button', { type: 'submit' }, 'Acknowledge'));
}

function newEventForm(x, reload, status) {
  const t = uid('evt'), c = uid('cause'), n = uid('note');
  const title = el('input', { id: t, required: true, maxlength: 200, value: '' });
  const cause = select(c, CAUSES, 'UNDETERMINED');
  const note = el('textarea', { id: n, rows: 2, required: true, maxlength: 4000 });
  return el('details', { class: 'sub' }, el('summary', {}, 'Record an event for this excursion'),
    el('form', { class: 'inline-form', onsubmit: async (e) => {
      e.preventDefault();
      try {
        await api.post(F.paths.events(), F.eventBody(title.value.trim(), cause.value, note.value.trim(), [x]));
        title.value = ''; note.value = '';
        status('Event recorded.');
        await reload();
      } catch (err) { status('Could not record the event (' + err.message + ').'); }
    } }, el('label', { for: t }, 'Title'), title, el('label', { for: c }, 'Cause'), cause,
    el('label', { for: n }, 'Note (what was seen, what was done)'), note, el('button', { type: 'submit' }, 'Record event')));
}

function excursionCard(x, caller, reload, status) {
  const history = x.acknowledgements.length
    ? el('ol', { class: 'history', 'aria-label': 'Acknowledgement history' }, x.acknowledgements.map((a) => el('li', {},
      el('time', { datetime: a.at }, when(a.at)), ' ', el('strong', {}, a.by), ': ', a.note)))
    : el('p', { class: 'muted' }, 'Not acknowledged yet.');
  return el('article', { class: 'card excursion' + (x.open ? ' open' : ''), 'data-point': x.point, 'data-parameter': x.parameter },
    el('h4', {}, badge(x.highest, x.inDoubtFraction > 0.5), ' ', x.point + ' · ' + parameterName(x.parameter)),
    el('p', {}, (x.open ? 'Open since ' : 'From ') + when(x.start) + '; peak ' + sig(x.peak) + ' ' + unit(x.unit) + ' at ' + when(x.peakTime)
      + '; now ' + (CODE[x.current] ? CODE[x.current].word : words(x.current)) + '.'),
    el('p', { class: x.open ? 'countdown' : 'muted' }, allowance(x)),
    x.inDoubtFraction > 0 ? el('p', { class: 'muted' }, fmt(100 * x.inDoubtFraction, 0) + ' % of its samples had the instrument in doubt.') : null,
    x.limitsOrigin === 'DEFAULT' ? el('p', { class: 'muted' }, 'Judged by the shipped example limits, not the plant\'s own.') : null,
    el('h5', {}, 'History'), history,
    caller && caller.acknowledge ? ackForm(x, reload, status) : null,
    caller && caller.acknowledge ? newEventForm(x, reload, status) : null);
}

function eventCard(ev, caller, reload, status) {
  const s = uid('st'), c = uid('cause'), n = uid('note');
  const note = el('textarea', { id: n, rows: 2, required: true, maxlength: 4000 });
  const st = select(s, STATUSES, null, 'keep the status');
  const cause = select(c, CAUSES, null, 'keep the cause');
  return el('article', { class: 'card event', 'data-event': String(ev.id) },
    el('h4', {}, ev.title),
    el('p', {}, el('strong', {}, words(ev.status)), ' · cause: ' + words(ev.cause) + ' · opened ' + when(ev.createdAt) + ' by ' + ev.by),
    el('p', { class: 'muted' }, 'Excursions: ' + ev.excursions.map((m) => m.point + ' ' + parameterName(m.parameter) + ' from ' + when(m.start)).join('; ')),
    el('h5', {}, 'Notes and actions'),
    el('ol', { class: 'history' }, ev.entries.map((e) => el('li', {}, el('time', { datetime: e.at }, when(e.at)), ' ', el('strong', {}, e.by),
      (e.status ? ' [status ' + words(e.status) + ']' : '') + (e.cause ? ' [cause ' + words(e.cause) + ']' : '') + ': ', e.note))),
    caller && caller.acknowledge ? el('form', { class: 'inline-form', onsubmit: async (e) => {
      e.preventDefault();
      try {
        await api.post(F.paths.eventEntries(ev.id), F.entryBody(st.value, cause.value, note.value.trim()));
        note.value = '';
        status('Note added to the event.');
        await reload();
      } catch (err) { status('Could not add the note (' + err.message + ').'); }
    } }, el('label', { for: n }, 'Note or action taken'), note, el('label', { for: s }, 'Status'), st, el('label', { for: c }, 'Cause'), cause,
    el('button', { type: 'submit' }, 'Add note')) : null);
}

let last = null;
// the last answers, asked again with their ETags: unchanged lists come back as 304 without a body
let answers = { plant: null, excursions: null, events: null };
export async function refresh(plant, points, caller, status, force) {
  last = { plant, points, caller, status };
  if (!force && busy()) return;
  const reload = () => refresh(plant, points, caller, status, true);
  try {
    const from = new Date(Date.now() - 7 * 86400000).toISOString();
    const earlier = answers.plant === plant ? answers : { plant };
    const [gotX, gotE] = await Promise.all([
      api.getIfChanged(F.paths.excursions({ plant, from }), earlier.excursions),
      api.getIfChanged(F.paths.events(), earlier.events),
    ]);
    if (last.plant !== plant) return;
    answers = { plant, excursions: gotX, events: gotE };
    document.body.dataset.eventsAnswer = gotX.notModified && gotE.notModified ? 'not-modified' : 'full'; // for PageIT
    const xs = F.excursions(gotX.notModified ? F.agedExcursions(gotX.json, (Date.now() - gotX.at) / 1000) : gotX.json);
    const evs = F.events(gotE.json);
    xs.sort((a, b) => (b.open - a.open) || Date.parse(b.start) - Date.parse(a.start));
    const ids = new Set(points.map((p) => p.id));
    const mine = evs.filter((e) => e.excursions.some((m) => ids.has(m.point)));
    const open = xs.filter((x) => x.open), closed = xs.filter((x) => !x.open);
    $('excursions').replaceChildren(...[
      open.length ? el('div', { class: 'cards' }, open.map((x) => excursionCard(x, caller, reload, status))) : el('p', {}, 'No open excursion.'),
      closed.length ? el('details', {}, el('summary', {}, closed.length + ' excursion(s) ended in the last 7 days'),
        el('div', { class: 'cards' }, closed.map((x) => excursionCard(x, caller, reload, status)))) : null].filter(Boolean));
    $('event-list').replaceChildren(mine.length ? el('div', { class: 'cards' }, mine.map((e) => eventCard(e, caller, reload, status)))
      : el('p', {}, 'No event recorded for this plant.'));
    document.body.dataset.events = 'loaded';
  } catch (e) {
    status('Could not load the events (' + e.message + ').');
  }
}

// Time entry of our own: "YYYY-MM-DD HH:MM" on the 24-hour clock, in the zone the page shows times in
// (the browser's or UTC, chosen in the header), with that zone named beside the field. A browser's
// datetime-local input follows its locale (12-hour with AM/PM at en-US), which chemists misread.
// Bad input gets an inline message and nothing is sent; an empty field is never taken as "now".
'use strict';
import { $, el, zone } from './dom.js';

export const FORM = 'YYYY-MM-DD HH:MM';
const pad = (n, w = 2) => String(n).padStart(w, '0');
const utc = () => zone.name === 'UTC';

/** An instant's wall-clock fields [year, month, day, hour, minute] in the page's zone. */
function parts(date) {
  return utc()
    ? [date.getUTCFullYear(), date.getUTCMonth() + 1, date.getUTCDate(), date.getUTCHours(), date.getUTCMinutes()]
    : [date.getFullYear(), date.getMonth() + 1, date.getDate(), date.getHours(), date.getMinutes()];
}

/** An instant as the field shows it: 2026-12-03 14:05 (24-hour, the page's zone, to the minute). */
export function format(date) {
  const [y, mo, d, h, mi] = parts(date);
  return pad(y, 4) + '-' + pad(mo) + '-' + pad(d) + ' ' + pad(h) + ':' + pad(mi);
}

/** The zone as the field names it: "UTC", or "UTC+01:00 (Europe/Berlin)" with the offset at that instant. */
export function zoneText(date) {
  if (utc()) return 'UTC';
  const off = -date.getTimezoneOffset(), a = Math.abs(off);
  return 'UTC' + (off < 0 ? '-' : '+') + pad(Math.floor(a / 60)) + ':' + pad(a % 60) + ' (' + zone.name + ')';
}

/** The field's text as an instant: { date } or { error } in words a chemist can act on. */
export function parse(text) {
  const s = String(text || '').trim();
  const example = ', e.g. ' + format(new Date());
  if (!s) return { error: 'Enter the time as ' + FORM + ' (24-hour clock)' + example + '.' };
  const m = /^(\d{4})-(\d{1,2})-(\d{1,2})[ T](\d{1,2}):(\d{2})$/.exec(s);
  if (!m) return { error: '“' + s + '” is not a time as ' + FORM + ' (24-hour clock, no AM/PM)' + example + '.' };
  const [y, mo, d, h, mi] = m.slice(1).map(Number);
  if (mo < 1 || mo > 12 || d < 1 || d > new Date(Date.UTC(y, mo, 0)).getUTCDate()) {
    return { error: y + '-' + pad(mo) + '-' + pad(d) + ' is not a date (year-month-day).' };
  }
  if (h > 23 || mi > 59) return { error: pad(h) + ':' + pad(mi) + ' is not a time of day (00:00 to 23:59, 24-hour clock).' };
  const date = utc() ? new Date(Date.UTC(y, mo - 1, d, h, mi)) : new Date(y, mo - 1, d, h, mi);
  const wanted = [y, mo, d, h, mi].join();
  if (parts(date).join() !== wanted) {
    return { error: s + ' does not exist in ' + zone.name + ' (the clocks went forward then); choose UTC under "Times in" to enter it.' };
  }
  // a wall time the clocks pass twice (when they go back) would be a guess: ask for UTC instead
  if ([30, 60].some((later) => parts(new Date(date.getTime() + later * 60000)).join() === wanted)) {
    return { error: s + ' happens twice in ' + zone.name + ' (the clocks went back then); choose UTC under "Times in" to enter it.' };
  }
  return { date };
}

function showZone(input) {
  const r = parse(input.value);
  $(input.id + '-zone').textContent = '(24-hour clock, ' + zoneText(r.date || new Date()) + ')';
}

/** Shows a message under the field (or clears it with null); the field is marked invalid for screen readers. */
export function showError(input, message) {
  const box = $(input.id + '-error');
  box.textContent = message || '';
  box.hidden = !message;
  if (message) input.setAttribute('aria-invalid', 'true');
  else input.removeAttribute('aria-invalid');
}

/**
 * A labelled time field: the label with the zone the field is read in, the text input, and a place
 * for its error (tied to the input by aria-describedby). It follows now until the user edits it.
 */
export function field(id, label) {
  const input = el('input', {
    id, type: 'text', autocomplete: 'off', spellcheck: 'false', placeholder: FORM, 'aria-required': 'true',
    maxlength: '20', size: '17', 'data-time': '', 'aria-describedby': id + '-error',
  });
  // the zone is part of the label, so a screen reader names the field with it and the row stays one line high
  const box = el('div', { class: 'timefield' },
    el('label', { for: id }, label, ' ', el('small', { id: id + '-zone', class: 'zone' })),
    input,
    el('span', { id: id + '-error', class: 'field-error', role: 'alert', hidden: true }));
  input.addEventListener('input', () => {
    input.dataset.edited = '1';
    showZone(input);
    if (input.hasAttribute('aria-invalid') && !parse(input.value).error) showError(input, null);
  });
  input.addEventListener('change', () => showError(input, parse(input.value).error || null));
  return box;
}

/** Sets the field to now (to the minute) unless the user has edited it. */
export function followNow(input) {
  if (!input.dataset.edited) input.value = format(new Date());
  showZone(input);
}

/** Sets the field to now and lets it follow now again. */
export function reset(input) {
  delete input.dataset.edited;
  showError(input, null);
  followNow(input);
}

/** The field's instant, or null after showing why not (the field gets the focus). */
export function read(input) {
  const r = parse(input.value);
  showError(input, r.error || null);
  if (r.error) input.focus();
  return r.error ? null : r.date;
}

/** The page's zone changes: each time field keeps its instant, written in the new zone. */
export function switchZone(name) {
  const fields = [...document.querySelectorAll('input[data-time]')];
  const kept = fields.map((f) => parse(f.value).date);
  zone.name = name;
  fields.forEach((f, i) => {
    if (kept[i]) f.value = format(kept[i]);
    showZone(f);
  });
}

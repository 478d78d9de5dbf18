// Kwanta chemist page: plain JavaScript modules over the public API, no build step.
// Data from the API enters the page as text nodes only; the Content-Security-Policy forbids inline script.
'use strict';
import * as F from './fields.js';
import * as api from './api.js';
import { $, el, when } from './dom.js';
import { legend } from './levels.js';
import * as board from './board.js';
import * as events from './events.js';
import * as detail from './detail.js';
import * as entry from './entry.js';
import { switchZone } from './timeinput.js';

const state = { caller: null, points: [], plant: null, open: null, board: null, refreshed: 0 };
/** The board's refresh period, ms; the board is not asked while the tab is hidden. */
const REFRESH = 15000;

function status(text) { $('status').textContent = text || ''; $('status').dataset.kind = ''; }

function showCaller() {
  const c = state.caller;
  $('key-form').hidden = !!c;
  $('who').hidden = !c;
  $('who-text').textContent = c ? 'Signed in as ' + c.name + ', ' + c.role : '';
  document.body.dataset.role = c ? c.role : '';
}

async function signIn() {
  if (!api.key()) { state.caller = null; showCaller(); status('Sign in with an API key (read, chemist or admin role).'); return false; }
  try {
    state.caller = F.caller(await api.get(F.paths.caller()));
    showCaller();
    if (!state.caller.read) { status('This key (role ' + state.caller.role + ') cannot read; use a read, chemist or admin key.'); return false; }
    status(''); // the sign-in prompt is answered
    return true;
  } catch (e) {
    state.caller = null; showCaller();
    status(e.status === 401 ? 'That key was not accepted (unknown, revoked or mistyped).' : 'Could not check the key (' + e.message + ').');
    if (e.status === 401) api.clearKey();
    return false;
  }
}

async function loadPlants() {
  const plants = F.plants(await api.get(F.paths.plants()));
  const select = $('plant');
  select.replaceChildren(...plants.map((p) => el('option', { value: p.id }, p.name)));
  // the plant in the address (#plant=ID) is shown first, so a link can point at a plant
  const wanted = new URLSearchParams(location.hash.slice(1)).get('plant');
  if (wanted && plants.some((p) => p.id === wanted)) select.value = wanted;
  state.plant = select.value;
}

function reportLink(plant) {
  const month = new Date().toISOString().slice(0, 7);
  const q = new URLSearchParams({ plant, month });
  $('report-link').href = 'report.html?' + q.toString();
}

async function refresh() {
  const plant = $('plant').value;
  if (!plant || !state.caller) return;
  reportLink(plant);
  state.refreshed = Date.now();
  try {
    // asked with the last answer's ETag: unchanged data comes back as 304 without a body
    const earlier = state.board && state.board.plant === plant ? state.board : null;
    const got = await api.getIfChanged(F.paths.overview(plant), earlier);
    if ($('plant').value !== plant) return; // another plant was chosen meanwhile
    state.board = { ...got, plant };
    document.body.dataset.boardAnswer = got.notModified ? 'not-modified' : 'full'; // for PageIT
    const o = F.overview(got.notModified ? F.agedOverview(got.json, (Date.now() - got.at) / 1000) : got.json);
    state.points = o.points;
    $('overview').querySelector('tbody').replaceChildren(...board.rows(o.points, openPoint));
    $('board-summary').textContent = board.summary(o.points);
    $('as-of').textContent = 'as of ' + when(o.asOf);
    document.body.dataset.loaded = 'board';
    if (!performance.getEntriesByName('board-shown').length) performance.mark('board-shown'); // first paint figures (PageIT)
    if ($('status').dataset.kind === 'board') status('');
  } catch (e) {
    status('Could not load the board (' + e.message + ').');
    $('status').dataset.kind = 'board';
  }
  events.refresh(plant, state.points, state.caller, status);
  entry.show(plant, state.caller, state.points, status, (point) => { if (state.open === point) detail.redraw(); });
}

function openPoint(p) {
  state.open = p.id;
  detail.open(p, state.caller, status);
  $('detail').hidden = false;
  $('detail').scrollIntoView({ block: 'start' });
}

function setupZones() {
  const local = Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
  const zones = local === 'UTC' ? ['UTC'] : [local, 'UTC'];
  $('tz').replaceChildren(...zones.map((z) => el('option', { value: z }, z)));
  $('tz').addEventListener('change', () => { switchZone($('tz').value); refresh(); detail.redraw(); });
}

$('key-form').addEventListener('submit', (e) => {
  e.preventDefault();
  api.setKey($('key').value.trim());
  $('key').value = '';
  start();
});
$('signout').addEventListener('click', () => {
  api.clearKey();
  state.caller = null;
  state.board = null;
  showCaller();
  $('overview').querySelector('tbody').replaceChildren();
  $('board-summary').textContent = '';
  $('detail').hidden = true;
  events.clear();
  entry.clear();
  status('Signed out. The key is gone from this tab.');
});
$('plant').addEventListener('change', () => {
  history.replaceState(null, '', '#plant=' + encodeURIComponent($('plant').value));
  $('detail').hidden = true;
  refresh();
});

async function start() {
  if (!(await signIn())) return;
  try {
    await loadPlants();
    await refresh();
  } catch (e) {
    status('Could not load the plants (' + e.message + ').');
  }
}

$('legend').replaceChildren(legend());
setupZones();
start();
// every 15 s while the tab is shown; a hidden tab asks nothing, and is brought up to date when shown again
setInterval(() => { if (state.caller && document.visibilityState === 'visible') refresh(); }, REFRESH);
document.addEventListener('visibilitychange', () => {
  if (document.visibilityState === 'visible' && state.caller && Date.now() - state.refreshed >= REFRESH) refresh();
});

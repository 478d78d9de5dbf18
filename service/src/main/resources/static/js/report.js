// Kwanta printable report: plain JavaScript over the API. Builds DOM nodes only (no HTML from strings),
// no inline script or style, so it runs under the page's strict Content-Security-Policy.
'use strict';
import { unit, words, parameterName as parameter } from './dom.js';

const SVG = 'http://www.w3.org/2000/svg';
const LEVELS = ['NORMAL', 'AL1', 'AL2', 'AL3', 'SHUTDOWN'];
/** The glyphs of the level code (docs/level-code.md), as on the chemist page. */
const GLYPH = { NORMAL: '○', OUTSIDE_NORMAL: '◇', AL1: '▲', AL2: '◆', AL3: '■', SHUTDOWN: '✖' };

const $ = (id) => document.getElementById(id);

function el(tag, text, cls) {
  const e = document.createElement(tag);
  if (text !== undefined && text !== null) e.textContent = String(text);
  if (cls) e.className = cls;
  return e;
}

function svg(tag, attrs) {
  const e = document.createElementNS(SVG, tag);
  for (const [k, v] of Object.entries(attrs || {})) e.setAttribute(k, String(v));
  return e;
}

/** An instant of the API (ISO, UTC) as the page writes times: 2026-12-03 06:47 UTC (24-hour). */
function utc(iso) {
  const m = /^(\d{4}-\d{2}-\d{2})T(\d{2}:\d{2})/.exec(String(iso || ''));
  return m ? m[1] + ' ' + m[2] + ' UTC' : String(iso || '–');
}

function num(v, digits) {
  return v === null || v === undefined ? '–' : Number(v).toFixed(digits);
}

function pct(v) {
  return v === null || v === undefined ? '–' : (100 * v).toFixed(2) + ' %';
}

function row(tbody, cells) {
  const tr = document.createElement('tr');
  for (const c of cells) {
    const td = el('td', c.text !== undefined ? c.text : c, c.num ? 'num' : null);
    tr.appendChild(td);
  }
  tbody.appendChild(tr);
}

function clear(node) {
  while (node.firstChild) node.removeChild(node.firstChild);
}

async function get(path) {
  const key = sessionStorage.getItem('kwanta.key') || '';
  const headers = { Accept: 'application/json' };
  if (key) headers.Authorization = 'Bearer ' + key;
  const r = await fetch(path, { headers });
  if (!r.ok) {
    let detail = r.status + ' ' + r.statusText;
    try { detail = (await r.json()).detail || detail; } catch (e) { /* not JSON */ }
    throw new Error(detail);
  }
  return r.json();
}

/** One horizontal bar per channel, split by level, scaled to its in-service hours. */
function bars(channels) {
  const box = $('bars');
  clear(box);
  const width = 600;
  for (const c of channels) {
    // the hours per level in words too: nothing is told by colour or hover alone
    const parts = LEVELS.filter((l) => (c.hoursByLevel[l] || 0) > 0)
      .map((l) => GLYPH[l] + ' ' + l.replace('_', ' ').toLowerCase().replace(/^al/, 'AL').replace('shutdown', 'SHUTDOWN') + ' ' + num(c.hoursByLevel[l], 1) + ' h');
    const label = el('div', c.samplePoint + ' · ' + parameter(c.parameter) + ' (' + num(c.hoursInService, 1) + ' h in service: '
      + parts.join(' · ') + ')', 'small');
    box.appendChild(label);
    const s = svg('svg', { width, height: 18, viewBox: '0 0 ' + width + ' 18', role: 'img', 'aria-label': label.textContent });
    let x = 0;
    for (const level of LEVELS) {
      const h = c.hoursByLevel[level] || 0;
      if (h <= 0 || c.hoursInService <= 0) continue;
      const w = Math.max(1, (width * h) / c.hoursInService);
      const r = svg('rect', { x, y: 0, width: w, height: 16, class: 'lvl-' + level });
      const t = svg('title');
      t.textContent = level + ': ' + num(h, 2) + ' h';
      r.appendChild(t);
      s.appendChild(r);
      x += w;
    }
    box.appendChild(s);
  }
}

/** A trend of one channel over the period with its action-level thresholds in force now. */
async function trend(report, c) {
  const box = $('trends');
  const [series, limits] = await Promise.all([
    get('/api/v1/sample-points/' + encodeURIComponent(c.samplePoint) + '/series?parameter='
      + encodeURIComponent(c.parameter) + '&from=' + report.from + '&to=' + report.asOf + '&maxPoints=400'),
    get('/api/v1/sample-points/' + encodeURIComponent(c.samplePoint) + '/limits').catch(() => []),
  ]);
  const points = (series.buckets || []).map((b) => [Date.parse(b.start), b.max])
    .concat((series.points || []).filter((p) => p.value !== null).map((p) => [Date.parse(p.time), p.value]));
  box.appendChild(el('h3', c.samplePoint + ' · ' + parameter(c.parameter) + ' (' + unit(series.unit) + '), bucket maximum'));
  if (points.length === 0) {
    box.appendChild(el('p', 'No data in the period.', 'small'));
    return;
  }
  const thresholds = [];
  for (const p of limits) {
    if (p.limits && p.limits.parameter === c.parameter) {
      for (const t of p.limits.thresholds || []) thresholds.push(t);
    }
  }
  const W = 640, H = 180, L = 40, B = 20;
  const t0 = Date.parse(report.from), t1 = Date.parse(report.asOf);
  let vmax = Math.max(...points.map((p) => p[1]), ...thresholds.map((t) => t.value));
  vmax = vmax > 0 ? vmax * 1.1 : 1;
  const x = (t) => L + ((W - L - 5) * (t - t0)) / Math.max(1, t1 - t0);
  const y = (v) => H - B - ((H - B - 5) * v) / vmax;
  const s = svg('svg', { width: W, height: H, viewBox: '0 0 ' + W + ' ' + H, role: 'img', 'aria-label': 'trend of ' + c.samplePoint + ' ' + parameter(c.parameter) });
  s.appendChild(svg('line', { x1: L, y1: H - B, x2: W, y2: H - B, stroke: '#333' }));
  s.appendChild(svg('line', { x1: L, y1: 0, x2: L, y2: H - B, stroke: '#333' }));
  const top = svg('text', { x: 2, y: 12, class: 'axis' });
  top.textContent = num(vmax, 2);
  s.appendChild(top);
  for (const t of thresholds) {
    s.appendChild(svg('line', { x1: L, y1: y(t.value), x2: W, y2: y(t.value), class: 'limit' }));
    const lt = svg('text', { x: W - 60, y: y(t.value) - 2, class: 'axis' });
    lt.textContent = t.level + ' ' + t.value;
    s.appendChild(lt);
  }
  points.sort((a, b) => a[0] - b[0]);
  // no line across a stretch without data (a shut-down, an analyser off): a new segment after a gap
  const gap = 2 * 1000 * (series.bucketSeconds || 3600);
  let segment = [];
  const flush = () => {
    if (segment.length > 0) {
      s.appendChild(svg('polyline', {
        points: segment.map((p) => x(p[0]).toFixed(1) + ',' + y(p[1]).toFixed(1)).join(' '),
        class: 'trend',
      }));
    }
    segment = [];
  };
  for (const p of points) {
    if (segment.length > 0 && p[0] - segment[segment.length - 1][0] > gap) flush();
    segment.push(p);
  }
  flush();
  box.appendChild(s);
}

function render(r) {
  $('title').textContent = 'Chemistry report: ' + r.plantName + ' (' + r.plant + ')';
  $('period').textContent = (r.period === 'month' ? 'Month ' : 'Year ') + r.label + ' (UTC), '
    + utc(r.from) + ' to ' + utc(r.to) + (r.asOf !== r.to ? ', figures up to ' + utc(r.asOf) : '') + '. '
    + (r.counting || '').replace('IN_SERVICE time', 'time in service').replace(/^./, (c) => c.toUpperCase()) + '.';
  $('advisory').textContent = r.advisory;
  $('index').textContent = num(r.index.value, 2) + ' / 100  (chemistry ' + pct(r.index.chemistryScore)
    + ', availability ' + pct(r.index.availabilityScore) + ')';
  $('index-definition').textContent = r.index.definition;

  const blocks = $('blocks').tBodies[0];
  clear(blocks);
  for (const u of r.blocks) {
    const h = (s) => num(u.hoursByState[s] || 0, 2);
    row(blocks, [u.block, { text: num(u.hoursInService, 2), num: true }, { text: h('IN_SERVICE'), num: true },
      { text: h('START_UP'), num: true }, { text: h('SHUT_DOWN'), num: true }, { text: h('LAYUP_WET'), num: true },
      { text: h('LAYUP_DRY'), num: true }, { text: num(u.hoursUnrecorded, 2), num: true }]);
  }

  const channels = $('channels').tBodies[0];
  clear(channels);
  for (const c of r.channels) {
    row(channels, [c.samplePoint, parameter(c.parameter), { text: num(c.hoursInService, 2), num: true }]
      .concat(LEVELS.map((l) => ({ text: num(c.hoursByLevel[l] || 0, 2), num: true })))
      .concat([{ text: num(c.penalty, 5), num: true }]));
  }
  bars(r.channels);

  const events = $('events').tBodies[0];
  clear(events);
  if (r.events.length === 0) row(events, ['–', 'no excursion event in the period', '', '', '']);
  for (const e of r.events) row(events, [String(e.id), e.title, words(e.status), words(e.causeCategory), e.excursions.join(', ')]);

  const instruments = $('instruments').tBodies[0];
  clear(instruments);
  for (const i of r.instruments) {
    row(instruments, [i.samplePoint, parameter(i.parameter), { text: i.slotsInService, num: true },
      { text: i.slotsWithData, num: true }, { text: i.slotsGood, num: true },
      { text: pct(i.availability), num: true }, { text: pct(i.completeness), num: true }]);
  }

  const calibration = $('calibration').tBodies[0];
  clear(calibration);
  for (const c of r.calibration) {
    row(calibration, [c.samplePoint, parameter(c.parameter), words(c.kind), c.lastDone ? utc(c.lastDone) : 'never', c.nextDue ? utc(c.nextDue) : '–', words(c.status),
      { text: c.checksInPeriod, num: true }]);
  }

  const g = r.grabVsOnline;
  const note = g.note || '';
  $('grab').textContent = note.charAt(0).toUpperCase() + note.slice(1)
    + (g.comparisons.length ? '. Tolerances: ' + g.toleranceSource + '.' : '');
  $('grab').className = g.available ? '' : 'unavailable';
  const grabs = $('grabs').tBodies[0];
  clear(grabs);
  for (const c of g.comparisons) {
    row(grabs, [c.samplePoint, parameter(c.parameter), utc(c.grabTime), c.grab + ' ' + unit(c.unit),
      { text: c.onlineValue, num: true }, { text: c.deviation.toPrecision(3), num: true },
      { text: '± ' + c.tolerance, num: true }, c.verdict]);
  }
  $('grabs').hidden = g.comparisons.length === 0;
}

async function load() {
  const q = new URLSearchParams(location.search);
  const plant = q.get('plant');
  if (!plant) {
    $('status').textContent = 'Choose a plant and a month (YYYY-MM) or a year.';
    return;
  }
  $('plant').value = plant;
  $('month').value = q.get('month') || '';
  $('year').value = q.get('year') || '';
  const path = q.get('year') && !q.get('month')
    ? '/api/v1/plants/' + encodeURIComponent(plant) + '/reports/annual?year=' + encodeURIComponent(q.get('year'))
    : '/api/v1/plants/' + encodeURIComponent(plant) + '/reports/monthly?month=' + encodeURIComponent(q.get('month') || '');
  $('status').textContent = 'Loading…';
  try {
    const r = await get(path);
    render(r);
    $('status').textContent = '';
    clear($('trends'));
    const worst = r.channels.slice().sort((a, b) => b.penalty - a.penalty).slice(0, 3);
    for (const c of worst) await trend(r, c);
    document.body.dataset.loaded = 'report'; // for PageIT
  } catch (e) {
    $('status').textContent = 'Could not load the report (' + e.message + '). A read key may be needed.';
    document.body.dataset.loaded = 'failed';
  }
}

document.addEventListener('DOMContentLoaded', () => {
  $('report-form').addEventListener('submit', (e) => {
    e.preventDefault();
    const key = $('key').value.trim();
    if (key) sessionStorage.setItem('kwanta.key', key);
    $('key').value = '';
    const q = new URLSearchParams();
    q.set('plant', $('plant').value.trim());
    if ($('month').value.trim()) q.set('month', $('month').value.trim());
    else if ($('year').value.trim()) q.set('year', $('year').value.trim());
    location.search = q.toString();
  });
  $('print').addEventListener('click', () => window.print());
  load();
});

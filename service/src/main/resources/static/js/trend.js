// Trends with uPlot (served as a WebJar): bucket means with their min–max band, the limits in
// force at each time as stepped lines, the pH-at-temperature band shaded with the neutral pH,
// an optional second parameter on its own axis, a time axis in the chosen time zone, drag to zoom.
'use strict';
import * as F from './fields.js';
import * as api from './api.js';
import { $, el, unit, parameterName, zone, when } from './dom.js';
import * as labmarks from './labmarks.js';

const uPlot = window.uPlot;
const MIN_SPAN = 3600, MAX_SPAN = 90 * 86400, POINTS = 400;
/** Line colours per level, the level code's colours (docs/level-code.md). */
const LIMIT_COLOUR = { NORMAL: '#00707a', AL1: '#a66a00', AL2: '#8e2f9c', AL3: '#4b1360', SHUTDOWN: '#111111' };
const DERIVED = ['ph_at_temperature', 'calculated_ph_25', 'specific_conductivity_25', 'cation_conductivity_25', 'degassed_cation_conductivity_25'];

let ctx = null; // { p, config, status, window: [from, to] in s, chart }

/** The parameter whose limits apply to a series. */
const limitParameter = (s) => s === 'ph' ? 'ph' : s.endsWith('_conductivity_25') ? s.slice(0, -3) : s === 'calculated_ph_25' ? null : s;

/** The series to offer: derived ones where their inputs are measured, then the measured ones. */
function choices(p, config) {
  const all = [...new Set(config.parameters.concat(p.readings.map((r) => r.parameter)))];
  const measured = all.filter((x) => x !== 'sample_temperature');
  const derived = DERIVED.filter((d) => d === 'ph_at_temperature' || d === 'calculated_ph_25' ? all.includes('specific_conductivity')
    : all.includes(d.slice(0, -3)));
  return derived.concat(measured.filter((m) => !m.endsWith('conductivity'))).concat(all.includes('sample_temperature') ? ['sample_temperature'] : []);
}

async function fetchSeries(point, parameter, from, to) {
  return F.series(await api.get(F.paths.series(point, {
    parameter, from: new Date(from * 1000).toISOString(), to: new Date(to * 1000).toISOString(), maxPoints: POINTS,
  })));
}

async function limitHistory(point, parameter) {
  const lp = limitParameter(parameter);
  if (!lp) return null;
  try {
    return F.limitHistory(await api.get(F.paths.limitHistory(point, lp)));
  } catch (e) {
    return null; // no limits for this parameter here
  }
}

/** One series per threshold (level and side), its value in force at each time, null where none. */
function limitLines(history, t) {
  if (!history) return [];
  const keys = new Map();
  for (const per of history.periods) {
    if (!per.limits) continue;
    if (per.limits.normal && per.limits.normal.low !== null) keys.set('NORMAL LOW', { level: 'NORMAL', side: 'LOW' });
    if (per.limits.normal && per.limits.normal.high !== null) keys.set('NORMAL HIGH', { level: 'NORMAL', side: 'HIGH' });
    for (const th of per.limits.thresholds) keys.set(th.level + ' ' + th.side, { level: th.level, side: th.side });
  }
  const inForce = (time) => {
    let found = null;
    for (const per of history.periods) if (per.from <= time) found = per;
    return found && found.limits;
  };
  return [...keys.values()].map((k) => ({
    ...k,
    values: t.map((time) => {
      const l = inForce(time);
      if (!l) return null;
      if (k.level === 'NORMAL') return l.normal ? (k.side === 'LOW' ? l.normal.low : l.normal.high) : null;
      const th = l.thresholds.find((x) => x.level === k.level && x.side === k.side);
      return th ? th.value : null;
    }),
  })).filter((s) => s.values.some((v) => v !== null));
}

function fmtValue(v) { return v === null || v === undefined ? '–' : Math.abs(v) >= 10 ? v.toFixed(1) : Math.abs(v) >= 1 ? v.toFixed(2) : v.toFixed(3); }

async function draw() {
  const { p } = ctx;
  const parameter = $('trend-parameter').value, second = $('trend-second').value;
  const [from, to] = ctx.window;
  const ph = parameter === 'ph_at_temperature';
  const wanted = [fetchSeries(p.id, parameter, from, to), limitHistory(p.id, parameter)];
  if (ph) wanted.push(fetchSeries(p.id, 'ph_at_temperature_low', from, to), fetchSeries(p.id, 'ph_at_temperature_high', from, to),
    fetchSeries(p.id, 'neutral_ph_at_temperature', from, to));
  const secondSeries = second ? fetchSeries(p.id, second, from, to) : null;
  let main, history, low, high, neutral, other;
  try {
    [main, history, low, high, neutral] = await Promise.all(wanted);
    other = secondSeries ? await secondSeries : null;
  } catch (e) {
    ctx.status('Could not load the trend (' + e.message + ').');
    return;
  }
  const marks = await labmarks.forSeries(p.id, parameter, main.lab, from, to);
  const t = main.t;
  const align = (s) => { const m = new Map(s.t.map((x, i) => [x, s.mean[i]])); return t.map((x) => m.has(x) ? m.get(x) : null); };
  const u = unit(main.unit);
  const data = [t];
  const series = [{ label: 'time' }];
  const bands = [];
  if (ph) {
    data.push(align(high), align(low));
    series.push({ label: 'band high (instrument tolerances)', stroke: '#7a9cc6', width: 1, scale: 'y', value: (s, v) => fmtValue(v) },
      { label: 'band low', stroke: '#7a9cc6', width: 1, scale: 'y', value: (s, v) => fmtValue(v) });
    bands.push({ series: [1, 2], fill: 'rgba(80, 130, 200, 0.22)' });
    data.push(align(neutral));
    series.push({ label: 'neutral pH', stroke: '#6b6b6b', width: 1.5, dash: [2, 3], scale: 'y', value: (s, v) => fmtValue(v) });
  } else {
    data.push(main.max, main.min);
    series.push({ label: 'bucket max', stroke: 'rgba(22,50,79,0.25)', width: 1, scale: 'y', value: (s, v) => fmtValue(v) },
      { label: 'bucket min', stroke: 'rgba(22,50,79,0.25)', width: 1, scale: 'y', value: (s, v) => fmtValue(v) });
    bands.push({ series: [1, 2], fill: 'rgba(22,50,79,0.10)' });
  }
  data.push(main.mean);
  series.push({ label: parameterName(parameter) + (u ? ' (' + u + ')' : ''), stroke: '#16324f', width: 2, scale: 'y', value: (s, v) => fmtValue(v) });
  for (const line of limitLines(history, t)) {
    data.push(line.values);
    series.push({ label: (line.level === 'NORMAL' ? 'normal ' : line.level + ' ') + line.side.toLowerCase() + ' limit', stroke: LIMIT_COLOUR[line.level],
      width: 1.5, dash: line.level === 'NORMAL' ? [8, 4] : [4, 3], scale: 'y', paths: uPlot.paths.stepped({ align: 1 }), points: { show: false },
      value: (s, v) => fmtValue(v) });
  }
  if (other) {
    data.push(align(other));
    series.push({ label: parameterName(second) + ' (' + unit(other.unit) + ', right axis)', stroke: '#b35c00', width: 1.5, scale: 'y2', value: (s, v) => fmtValue(v) });
  }
  const target = $('trend');
  const width = Math.max(240, Math.min(1100, target.parentElement.clientWidth - 16));
  const axes = [
    { label: 'time (' + zone.name + ')', stroke: '#333', grid: { stroke: '#e6e9ee' }, space: 70, values: timeTicks },
    { scale: 'y', label: u || parameterName(parameter), stroke: '#16324f', grid: { stroke: '#e6e9ee' }, size: 60 },
  ];
  if (other) axes.push({ scale: 'y2', side: 1, label: unit(other.unit) || parameterName(second), stroke: '#b35c00', grid: { show: false }, size: 60 });
  const opts = {
    width, height: width < 500 ? 260 : 340,
    tzDate: (ts) => uPlot.tzDate(new Date(ts * 1000), zone.name),
    scales: { x: { time: true, range: () => [from, to] }, y: marks.length ? { auto: true, range: labmarks.yRange(marks) } : { auto: true }, y2: { auto: true } },
    plugins: [labmarks.plugin(marks)],
    series, bands, axes,
    cursor: { drag: { x: true, y: false }, points: { show: false } },
    legend: { live: true },
    hooks: { setSelect: [(chart) => zoom(chart)] },
  };
  if (ctx.chart) ctx.chart.destroy();
  target.replaceChildren();
  ctx.chart = t.length ? new uPlot(opts, data, target) : null;
  if (!t.length) target.append(el('p', {}, 'No data in this window.'));
  labmarks.list(marks, main.unit);
  $('trend-caption').textContent = parameterName(parameter) + ' at ' + p.id + ', ' + when(new Date(from * 1000).toISOString())
    + ' – ' + when(new Date(to * 1000).toISOString()) + ' (' + zone.name + '), buckets of '
    + (main.bucketSeconds >= 3600 ? (main.bucketSeconds / 3600).toFixed(1) + ' h' : main.bucketSeconds >= 60 ? Math.round(main.bucketSeconds / 60) + ' min' : (main.bucketSeconds || 0) + ' s') + '.'
    + (history ? '' : ' No limits for this parameter here.');
  document.body.dataset.trend = parameter;
}

/** Tick labels in 24-hour time in the chosen zone; the date where it changes, or only dates over long spans. */
function timeTicks(u, splits) {
  const span = splits.length > 1 ? splits[splits.length - 1] - splits[0] : 0;
  let lastDay = null;
  return splits.map((ts) => {
    const d = new Date(ts * 1000);
    const day = d.toLocaleDateString('en-GB', { timeZone: zone.name, day: 'numeric', month: 'short' });
    if (span > 3 * 86400) return day;
    const time = d.toLocaleTimeString('en-GB', { timeZone: zone.name, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });
    const label = day !== lastDay ? time + '\n' + day : time;
    lastDay = day;
    return label;
  });
}

function zoom(chart) {
  const s = chart.select;
  if (s.width < 5) return;
  let a = chart.posToVal(s.left, 'x'), b = chart.posToVal(s.left + s.width, 'x');
  if (b - a < MIN_SPAN) { const mid = (a + b) / 2; a = mid - MIN_SPAN / 2; b = mid + MIN_SPAN / 2; }
  ctx.window = [Math.floor(a), Math.ceil(b)];
  draw();
}

function reset() {
  const span = Math.min(MAX_SPAN, Math.max(MIN_SPAN, Number($('trend-range').value)));
  const to = Math.ceil(Date.now() / 1000);
  // Buckets of an hour or more are read from the hourly and daily rollups when the window starts
  // on the hour (docs/scaling.md): long windows start at the hour before.
  const from = span >= POINTS * 3600 ? Math.floor((to - span) / 3600) * 3600 : to - span;
  ctx.window = [from, to];
  draw();
}

export async function open(p, config, status) {
  ctx = { p, config, status, chart: ctx && ctx.chart };
  const list = choices(p, config);
  if (!list.length) {
    if (ctx.chart) { ctx.chart.destroy(); ctx.chart = null; }
    $('trend').replaceChildren(el('p', {}, 'No readings at this point yet.'));
    return;
  }
  $('trend-parameter').replaceChildren(...list.map((x) => el('option', { value: x }, parameterName(x))));
  $('trend-second').replaceChildren(el('option', { value: '' }, 'nothing else'), ...list.map((x) => el('option', { value: x }, parameterName(x))));
  if (list.includes('cation_conductivity_25')) $('trend-parameter').value = 'cation_conductivity_25';
  reset();
}

export function redraw() { if (ctx) draw(); }

$('trend-parameter').addEventListener('change', () => ctx && draw());
$('trend-second').addEventListener('change', () => ctx && draw());
$('trend-range').addEventListener('change', () => ctx && reset());
$('trend-reset').addEventListener('click', () => ctx && reset());
window.addEventListener('resize', () => {
  if (ctx && ctx.chart) {
    const w = Math.max(240, Math.min(1100, $('trend').parentElement.clientWidth - 16));
    ctx.chart.setSize({ width: w, height: w < 500 ? 260 : 340 });
  }
});

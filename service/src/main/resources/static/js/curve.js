// pH and neutral pH from 25 °C to the operating temperature for the point's current water (the
// composition the evaluation derived), with the band over alternative constants, and a what-if
// water drawn beside it (POST /chemistry/speciation/curve).
'use strict';
import * as F from './fields.js';
import * as api from './api.js';
import { $, el, fmt } from './dom.js';

const uPlot = window.uPlot;
let ctx = null; // { p, config, status, water, chart }

function waterOf(p, config, alk) {
  const c = p.composition || {};
  return [
    { component: alk, label: alk.replace(/_/g, ' '), amount: c.alkalizerMgPerKg || 0, unit: 'mg/kg' },
    { component: 'chloride', label: 'chloride (acid anions as chloride)', amount: c.chlorideUgPerKg || 0, unit: 'ug/kg' },
    { component: 'carbon_dioxide', label: 'carbon dioxide', amount: c.carbonDioxideUgPerKg || 0, unit: 'ug/kg' },
    { component: 'sodium', label: 'sodium', amount: c.sodiumUgPerKg || 0, unit: 'ug/kg' },
    { component: 'phosphate', label: 'phosphate', amount: c.phosphateMgPerKg || 0, unit: 'mg/kg' },
  ];
}

const round = (v) => v === 0 ? 0 : Number(Number(v).toPrecision(3));
const UNIT = { 'mg/kg': 'mg/kg', 'ug/kg': 'µg/kg' };

async function fetchCurve(water) {
  const { config } = ctx;
  const to = Math.max(26, Math.min(350, config.temperatureCel || 25));
  const n = Math.min(120, Math.max(1, Math.ceil((to - 25) / 2.5)));
  return F.curve(await api.post(F.paths.curve(), F.curveBody(water, 25, to, (to - 25) / n, config.pressureMPa)));
}

function draw(now, whatIf) {
  const x = now.rows.map((r) => r.t);
  const data = [x, now.rows.map((r) => r.high), now.rows.map((r) => r.low), now.rows.map((r) => r.neutral), now.rows.map((r) => r.ph)];
  const v = (s, val) => val === null || val === undefined ? '–' : val.toFixed(2);
  const series = [
    { label: 'temperature, °C', value: (s, val) => val === null ? '–' : val.toFixed(0) + ' °C' },
    { label: 'band high', stroke: '#7a9cc6', width: 1, value: v },
    { label: 'band low', stroke: '#7a9cc6', width: 1, value: v },
    { label: 'neutral pH', stroke: '#6b6b6b', width: 1.5, dash: [2, 3], value: v },
    { label: 'pH, current water', stroke: '#16324f', width: 2.5, value: v },
  ];
  if (whatIf) {
    const m = new Map(whatIf.rows.map((r) => [r.t, r.ph]));
    data.push(x.map((t) => m.has(t) ? m.get(t) : null));
    series.push({ label: 'pH, what-if water', stroke: '#b35c00', width: 2.5, dash: [8, 4], value: v });
  }
  const target = $('curve');
  const width = Math.max(240, Math.min(1100, target.parentElement.clientWidth - 16));
  const opts = {
    width, height: width < 500 ? 260 : 320,
    scales: { x: { time: false }, y: { auto: true } },
    series: series.map((x, i) => i ? { ...x, points: { show: false } } : x),
    bands: [{ series: [1, 2], fill: 'rgba(80, 130, 200, 0.22)' }],
    axes: [{ label: 'temperature, °C', grid: { stroke: '#e6e9ee' } }, { label: 'pH (molal activity scale)', size: 50, grid: { stroke: '#e6e9ee' } }],
    cursor: { drag: { x: false, y: false }, points: { show: false } },
  };
  if (ctx.chart) ctx.chart.destroy();
  target.replaceChildren();
  ctx.chart = new uPlot(opts, data, target);
  const last = now.rows[now.rows.length - 1];
  $('curve-caption').textContent = 'Current water: pH ' + fmt(now.phAt25, 2) + ' at 25 °C, ' + fmt(last.ph, 2) + ' at ' + fmt(last.t, 0)
    + ' °C (band ' + fmt(last.low, 2) + '–' + fmt(last.high, 2) + ', neutral ' + fmt(last.neutral, 2) + ')'
    + (whatIf ? '; what-if water: ' + fmt(whatIf.phAt25, 2) + ' at 25 °C, ' + fmt(whatIf.rows[whatIf.rows.length - 1].ph, 2) + ' at ' + fmt(last.t, 0) + ' °C' : '')
    + (ctx.config.pressureMPa ? ', at ' + fmt(ctx.config.pressureMPa, 1) + ' MPa.' : ', at saturation pressure.')
    + (now.rows.some((r) => r.extrapolated) ? ' Some constants are extrapolated at the top of the range.' : '');
  document.body.dataset.curve = whatIf ? 'what-if' : 'current';
}

function fields(water) {
  return water.map((w, i) => el('label', { class: 'num' }, w.label + ', ' + UNIT[w.unit],
    el('input', { type: 'number', min: '0', step: 'any', value: String(round(w.amount)), id: 'whatif-' + i, inputmode: 'decimal' })));
}

/** No curve, and why, in words (instead of a chart that could be another point's or alkalizer's). */
function noCurve(text) {
  if (ctx.chart) { ctx.chart.destroy(); ctx.chart = null; }
  ctx.now = null;
  $('curve').replaceChildren(el('p', {}, text));
  $('curve-caption').textContent = '';
  $('whatif').hidden = true;
}

export async function open(p, config, status) {
  const alk = F.alkalizerComponent(config.alkalizer);
  ctx = { p, config, status, chart: ctx && ctx.chart, water: alk ? waterOf(p, config, alk) : [] };
  $('whatif-fields').replaceChildren(...fields(ctx.water));
  if (!alk) {
    noCurve('The curve is not available: this point names no alkalizer ('
      + (config.alkalizer ? '\u201c' + config.alkalizer + '\u201d' : 'none given') + ') the speciation knows.');
    return;
  }
  if (!p.composition || !(config.temperatureCel > 25)) {
    noCurve(p.composition ? 'This point is sampled at 25 °C: no curve to draw.' : 'No evaluated water yet.');
    return;
  }
  $('whatif').hidden = false;
  try {
    ctx.now = await fetchCurve(ctx.water);
    draw(ctx.now, null);
  } catch (e) {
    noCurve('The curve is not available for this point (' + e.message + ').');
    status('Could not compute the curve (' + e.message + ').');
  }
}

$('whatif').addEventListener('submit', async (e) => {
  e.preventDefault();
  if (!ctx || !ctx.now) return;
  const water = ctx.water.map((w, i) => ({ ...w, amount: Math.max(0, Number($('whatif-' + i).value) || 0) }));
  try {
    draw(ctx.now, await fetchCurve(water));
  } catch (err) {
    ctx.status('Could not compute the what-if curve (' + err.message + ').');
  }
});
$('whatif-reset').addEventListener('click', () => {
  if (!ctx || !ctx.now) return;
  $('whatif-fields').replaceChildren(...fields(ctx.water));
  draw(ctx.now, null);
});

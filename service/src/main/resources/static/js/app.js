// Kwanta chemist page: plain JavaScript over the public API (read key kept in this browser only).
// Data from the API goes into the page as text nodes only (no HTML built from strings).
'use strict';
const $ = (id) => document.getElementById(id);
const key = () => localStorage.getItem('kwanta.key') || '';

async function api(path) {
  const headers = { Accept: 'application/json' };
  if (key()) headers.Authorization = 'Bearer ' + key();
  const r = await fetch(path, { headers });
  if (!r.ok) {
    let detail = r.statusText;
    try { detail = (await r.json()).detail || detail; } catch (e) { /* not JSON */ }
    throw new Error(r.status + ': ' + detail);
  }
  return r.json();
}

// el('span', { class: 'x', title: 't' }, 'text', otherNode): an element; strings become text nodes.
function el(tag, attrs, ...children) {
  const e = document.createElement(tag);
  for (const [k, v] of Object.entries(attrs || {})) {
    if (v !== undefined && v !== null) e.setAttribute(k, v);
  }
  for (const c of children.flat()) {
    if (c === null || c === undefined || c === false) continue;
    e.append(c instanceof Node ? c : document.createTextNode(String(c)));
  }
  return e;
}

// svg elements for the charts
function svgEl(tag, attrs, text) {
  const e = document.createElementNS('http://www.w3.org/2000/svg', tag);
  for (const [k, v] of Object.entries(attrs || {})) e.setAttribute(k, v);
  if (text !== undefined) e.textContent = text;
  return e;
}

const fmt = (v, digits) => (v === null || v === undefined || Number.isNaN(v)) ? '–' : Number(v).toFixed(digits);
const age = (s) => s === undefined ? '–' : s < 120 ? Math.round(s) + ' s' : s < 7200 ? Math.round(s / 60) + ' min' : Math.round(s / 3600) + ' h';
const words = (s) => String(s).toLowerCase().replace(/_/g, ' ');

// several nodes, one per line
function lines(nodes) {
  const out = [];
  nodes.forEach((n, i) => { if (i) out.push(el('br')); out.push(n); });
  return out;
}

function latest(state, parameter) {
  return (state.readings || []).find((r) => r.parameter === parameter);
}

// A level as a badge: colour by level (legend under the table); "?" when the instrument is in doubt.
const LEVEL_CLASS = { NORMAL: 'lvl-normal', OUTSIDE_NORMAL: 'lvl-outside', AL1: 'lvl-al1', AL2: 'lvl-al2', AL3: 'lvl-al3', SHUTDOWN: 'lvl-shutdown' };
function levels(state) {
  const ls = state.levels || [];
  if (ls.length === 0) return ['–'];
  const shown = ls.filter((l) => l.level !== 'NORMAL' || l.instrumentInDoubt);
  if (shown.length === 0) return [el('span', { class: 'lvl lvl-normal' }, 'normal')];
  return lines(shown.map((l) => el('span', {
    class: 'lvl ' + (LEVEL_CLASS[l.level] || ''),
    title: l.parameter + ' ' + fmt(l.value, 3) + ' ' + l.valueUnit + ' since ' + new Date(l.since).toLocaleString()
      + (l.instrumentInDoubt ? '; instrument in doubt' : '') + (l.calculatedValue ? '; calculated value' : ''),
  }, (l.level === 'OUTSIDE_NORMAL' ? 'outside normal' : l.level) + ' ' + l.parameter + (l.instrumentInDoubt ? ' ?' : ''))));
}

// The diagnosis of a row: the findings over time, then the instant checks not already among them.
function diagnosisCell(ev, findings, diagnosis) {
  if (findings.length === 0 && diagnosis.length === 0) {
    return ev ? [el('span', { class: 'ok' }, 'consistent')] : ['–'];
  }
  const nodes = diagnosis.map((f) => el('span', { class: f.pointsAt === 'process' ? 'bad' : 'warn', title: f.explanation },
    f.code + ' → ' + words(f.pointsAt)));
  findings.filter((f) => !diagnosis.some((d) => d.code === f.code)).forEach((f) => nodes.push(
    el('span', { class: f.suspect === 'PROCESS' ? 'bad' : 'warn', title: f.explanation }, f.code + ' → ' + words(f.suspect))));
  return lines(nodes);
}

function row(state) {
  const ev = state.evaluation && state.evaluation.evaluation;
  const at25 = (p) => {
    const c = ev && (ev.compensated || []).find((x) => x.parameter === p);
    return c ? c.at25USPerCm : undefined;
  };
  const ph = latest(state, 'ph');
  const na = latest(state, 'sodium');
  const t = ev && ev.phAtTemperature;
  const findings = ev ? ev.findings : [];
  const diagnosis = state.diagnosis ? state.diagnosis.findings : [];
  const cells = [
    [state.samplePoint, ' ', el('small', {}, state.name)],
    [state.treatmentRegime],
    [fmt(at25('specific_conductivity'), 3)],
    [fmt(at25('cation_conductivity'), 3)],
    [fmt(at25('degassed_cation_conductivity'), 3)],
    [ph ? fmt(ph.value, 2) : '–'],
    [ev && ev.calculatedPh ? fmt(ev.calculatedPh.rigorous, 2) : '–'],
    t ? [fmt(t.ph, 2), ' ', el('small', {}, '[' + fmt(t.low, 2) + '–' + fmt(t.high, 2) + '] at ' + fmt(t.temperatureCel, 0) + ' °C')] : ['–'],
    [t ? fmt(t.neutralPh, 2) : '–'],
    [na ? fmt(na.value, 2) : '–'],
    diagnosisCell(ev, findings, diagnosis),
    [state.evaluation ? age(state.evaluation.ageSeconds) : '–'],
    levels(state),
  ];
  const tr = el('tr', {}, cells.map((c, i) => el('td', { class: i === 10 ? 'checks' : i === 12 ? 'levels' : null }, c)));
  if (state.evaluation && state.evaluation.ageSeconds > 900) tr.classList.add('stale');
  tr.addEventListener('click', () => detail(state));
  return tr;
}

async function loadPlants() {
  const plants = await api('api/v1/plants');
  const select = $('plant');
  select.replaceChildren(...plants.map((p) => el('option', { value: p.id }, p.name)));
  // the plant in the address (#plant=ID) is shown first, so a link can point at a plant
  const wanted = new URLSearchParams(location.hash.slice(1)).get('plant');
  if (wanted && plants.some((p) => p.id === wanted)) select.value = wanted;
}

async function refresh() {
  const plant = $('plant').value;
  if (!plant) return;
  try {
    const overview = await api('api/v1/plants/' + encodeURIComponent(plant) + '/overview');
    if ($('plant').value !== plant) return; // another plant was chosen meanwhile
    const body = $('overview').querySelector('tbody');
    body.replaceChildren(...overview.samplePoints.map(row));
    $('as-of').textContent = 'as of ' + new Date(overview.asOf).toLocaleString();
    $('status').textContent = '';
  } catch (e) {
    $('status').textContent = 'Could not load the overview (' + e.message + '). A read key may be needed.';
  }
}

function chart(svg, series, colours) {
  const W = 600, H = 220, L = 40, B = 20;
  const all = series.flatMap((s) => s.points.map((p) => p.y)).filter((y) => y !== null && Number.isFinite(y));
  if (all.length === 0) { svg.replaceChildren(svgEl('text', { x: 20, y: 40 }, 'no data')); return; }
  let lo = Math.min(...all), hi = Math.max(...all);
  if (hi - lo < 1e-9) { lo -= 0.5; hi += 0.5; }
  const t0 = Math.min(...series.flatMap((s) => s.points.map((p) => p.x)));
  const t1 = Math.max(...series.flatMap((s) => s.points.map((p) => p.x)));
  const x = (t) => L + (W - L - 5) * (t - t0) / Math.max(1, t1 - t0);
  const y = (v) => H - B - (H - B - 10) * (v - lo) / (hi - lo);
  const nodes = [svgEl('text', { x: 2, y: 14, 'font-size': 10 }, hi.toPrecision(4)),
    svgEl('text', { x: 2, y: H - B, 'font-size': 10 }, lo.toPrecision(4))];
  series.forEach((s, i) => {
    const d = s.points.filter((p) => p.y !== null).map((p, j) => (j ? 'L' : 'M') + x(p.x).toFixed(1) + ',' + y(p.y).toFixed(1)).join('');
    if (d) nodes.push(svgEl('path', { d, fill: 'none', stroke: colours[i], 'stroke-width': i === 0 ? 2 : 1 }));
  });
  svg.replaceChildren(...nodes);
}

async function series(point, parameter) {
  const to = new Date(), from = new Date(to.getTime() - 86400000);
  const q = new URLSearchParams({ parameter, from: from.toISOString(), to: to.toISOString(), maxPoints: 300 });
  const r = await api('api/v1/sample-points/' + encodeURIComponent(point) + '/series?' + q);
  return { points: r.buckets.map((b) => ({ x: Date.parse(b.start), y: b.mean })) };
}

function evidence(e) {
  return e ? el('small', {}, ' (' + e.quantity + ': expected ' + fmt(e.expected, 3) + ', read ' + fmt(e.read, 3)
    + ', residual ' + fmt(e.residual, 3) + ', tolerance ±' + fmt(e.tolerance, 3) + ' ' + e.unit + ')') : null;
}

async function detail(state) {
  $('detail').hidden = false;
  $('detail-title').textContent = state.samplePoint + ' – ' + state.name;
  const ev = state.evaluation && state.evaluation.evaluation;
  const diagnosis = state.diagnosis ? state.diagnosis.findings : [];
  const items = diagnosis.map((f) => el('li', {}, el('strong', {}, f.code), ' → ' + words(f.pointsAt) + ': ' + f.explanation, evidence(f.evidence)));
  (ev ? ev.findings : []).forEach((f) => items.push(
    el('li', {}, el('strong', {}, f.code), ' → ' + words(f.suspect) + ' (instant check): ' + f.explanation)));
  if (items.length === 0) {
    items.push(el('li', {}, 'No finding now: the channels agree with each other, their baselines and the neighbouring points.'));
  }
  $('findings').replaceChildren(...items);
  try {
    const r = await api('api/v1/sample-points/' + encodeURIComponent(state.samplePoint) + '/findings');
    const spans = [];
    for (const m of r.minutes) {
      const k = m.findings.map((f) => f.code + ' → ' + words(f.pointsAt)).join(', ');
      const last = spans[spans.length - 1];
      if (last && last.key === k && Date.parse(m.time) - Date.parse(last.to) <= 5 * 60000) last.to = m.time;
      else spans.push({ key: k, from: m.time, to: m.time });
    }
    $('history').replaceChildren(...(spans.length
      ? spans.reverse().map((s) => el('li', {}, s.from.substring(5, 16).replace('T', ' ') + ' – ' + s.to.substring(11, 16) + ' UTC: ' + s.key))
      : [el('li', {}, 'No finding in the last 24 h.')]));
  } catch (e) {
    $('history').replaceChildren(el('li', {}, 'Could not load the findings (' + e.message + ').'));
  }
  $('provenance').textContent = ev && ev.phAtTemperature
    ? 'pH at ' + fmt(ev.phAtTemperature.temperatureCel, 0) + ' °C and ' + fmt(ev.phAtTemperature.pressureMPa, 2) + ' MPa: ' + ev.phAtTemperature.formulation + '. Configuration version ' + ev.configVersion + '.'
    : '';
  try {
    const [ph, lo, hi, neutral, cc] = await Promise.all(['ph_at_temperature', 'ph_at_temperature_low', 'ph_at_temperature_high', 'neutral_ph_at_temperature', 'cation_conductivity_25'].map((p) => series(state.samplePoint, p)));
    chart($('chart-ph'), [ph, lo, hi, neutral], ['#16324f', '#9bb3cc', '#9bb3cc', '#c77d00']);
    chart($('chart-cc'), [cc], ['#7a2e8e']);
  } catch (e) {
    $('status').textContent = 'Could not load the series (' + e.message + ').';
  }
}

$('key-form').addEventListener('submit', (e) => {
  e.preventDefault();
  localStorage.setItem('kwanta.key', $('key').value.trim());
  $('key').value = '';
  start();
});
$('plant').addEventListener('change', () => {
  history.replaceState(null, '', '#plant=' + encodeURIComponent($('plant').value));
  refresh();
});

async function start() {
  try {
    await loadPlants();
    await refresh();
  } catch (e) {
    $('status').textContent = 'Could not load plants (' + e.message + '). Enter a read key above.';
  }
}
start();
setInterval(refresh, 15000);

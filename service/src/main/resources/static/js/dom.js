// DOM helpers: data from the API enters the page as text nodes and attribute values only.
'use strict';

export const $ = (id) => document.getElementById(id);

// el('span', { class: 'x', 'aria-label': 't' }, 'text', otherNode): strings become text nodes.
export function el(tag, attrs, ...children) {
  const e = document.createElement(tag);
  for (const [k, v] of Object.entries(attrs || {})) {
    if (v === undefined || v === null || v === false) continue;
    if (k.startsWith('on')) e.addEventListener(k.slice(2), v);
    else e.setAttribute(k, v === true ? '' : v);
  }
  for (const c of children.flat(Infinity)) {
    if (c === null || c === undefined || c === false) continue;
    e.append(c instanceof Node ? c : document.createTextNode(String(c)));
  }
  return e;
}

export const num = (v) => v !== null && v !== undefined && Number.isFinite(Number(v));
export const fmt = (v, digits) => num(v) ? Number(v).toFixed(digits) : '–';
/** Significant digits for conductivities and trace concentrations. */
export const sig = (v) => !num(v) ? '–' : Math.abs(v) >= 100 ? Number(v).toFixed(0) : Math.abs(v) >= 10 ? Number(v).toFixed(1) : Math.abs(v) >= 1 ? Number(v).toFixed(2) : Number(v).toFixed(3);

export function age(seconds) {
  if (!num(seconds)) return '–';
  const s = Math.max(0, seconds);
  return s < 120 ? Math.round(s) + ' s' : s < 7200 ? Math.round(s / 60) + ' min' : s < 172800 ? Math.round(s / 3600) + ' h' : Math.round(s / 86400) + ' d';
}

export function duration(seconds) {
  if (!num(seconds)) return '–';
  const m = Math.round(Math.abs(seconds) / 60);
  const d = Math.floor(m / 1440), h = Math.floor((m % 1440) / 60), mm = m % 60;
  return (d ? d + ' d ' : '') + (d || h ? h + ' h ' : '') + mm + ' min';
}

/** The time zone the page shows times in: the browser's or UTC (chosen in the header). */
export const zone = { name: Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC' };
export function when(iso) {
  if (!iso) return '–';
  return new Date(iso).toLocaleString(undefined, { timeZone: zone.name, year: 'numeric', month: 'short', day: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });
}

/** Units as the trade writes them (the API speaks UCUM). */
const UNIT = { 'uS/cm': 'µS/cm', 'ug/kg': 'µg/kg', 'mg/kg': 'mg/kg', '[pH]': 'pH', Cel: '°C', 'ug/L': 'µg/L' };
export const unit = (u) => UNIT[u] || u || '';

/** Parameter names in words. */
const PARAMETER = {
  specific_conductivity: 'specific conductivity', cation_conductivity: 'cation conductivity',
  degassed_cation_conductivity: 'degassed cation conductivity', ph: 'pH (measured, 25 °C)', sodium: 'sodium',
  dissolved_oxygen: 'dissolved oxygen', silica: 'silica', sample_temperature: 'sample temperature', iron: 'iron',
  chloride: 'chloride', sulfate: 'sulfate', phosphate: 'phosphate', hydrazine: 'hydrazine', copper: 'copper',
  specific_conductivity_25: 'specific conductivity at 25 °C', cation_conductivity_25: 'cation conductivity at 25 °C',
  degassed_cation_conductivity_25: 'degassed cation conductivity at 25 °C', calculated_ph_25: 'pH at 25 °C calculated',
  ph_at_temperature: 'pH at operating temperature', neutral_ph_at_temperature: 'neutral pH at operating temperature',
};
export const parameterName = (p) => PARAMETER[p] || String(p).replace(/_/g, ' ');
const SHORT = { specific_conductivity: 'SC', cation_conductivity: 'CACE', degassed_cation_conductivity: 'DCACE', ph: 'pH', sodium: 'Na', dissolved_oxygen: 'O₂', silica: 'SiO₂', sample_temperature: 'T sample' };
export const parameterShort = (p) => SHORT[p] || parameterName(p);

/** Treatment regimes and places in the cycle in words. */
const REGIME = { 'AVT(R)': 'AVT(R), all-volatile reducing', 'AVT(O)': 'AVT(O), all-volatile oxidizing', OT: 'oxygenated treatment', PT: 'phosphate treatment', CT: 'caustic treatment', MAKE_UP: 'make-up water' };
export const regimeName = (r) => REGIME[r] || String(r || '–');
export const words = (s) => String(s || '').toLowerCase().replace(/_/g, ' ');


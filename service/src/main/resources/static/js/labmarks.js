// Grab and lab results as markers on the trend: ● lab, ◆ grab, ▽ below the detection limit (drawn at
// the limit, "< DL"). Drawn by a uPlot plugin on the chart's own canvas, listed as text under the
// chart (for screen readers and for reading the values), and kept inside the y range.
'use strict';
import * as E from './entryfields.js';
import * as api from './api.js';
import { $, el, when, sig, unit } from './dom.js';

/** Glyph and colour per kind; the shape carries the meaning, the colour repeats it. */
export const MARK = {
  lab: { glyph: '●', colour: '#1b6e3a', word: 'lab result' },
  grab: { glyph: '◆', colour: '#b4460b', word: 'grab sample' },
  below: { glyph: '▽', word: 'below the detection limit (drawn at the limit)' },
};
const kind = (m) => (m.source === 'grab' ? 'grab' : 'lab');

/**
 * The grab and lab results for a trend series: a measured series carries them (labResults of the
 * series API); a conductivity at 25 °C shows those of the measured conductivity (labs report at
 * 25 °C); other derived series have none.
 */
export async function forSeries(point, parameter, mainLab, from, to) {
  if (mainLab) return mainLab.map(E.labPoint);
  if (!parameter.endsWith('_conductivity_25')) return [];
  try {
    const q = { parameter: parameter.slice(0, -3), from: new Date(from * 1000).toISOString(), to: new Date(to * 1000).toISOString() };
    return (await api.get(E.paths.pointLabResults(point, q))).map(E.labPoint);
  } catch (e) {
    return [];
  }
}

/** The y range with room for the markers too (uPlot's own padding). */
export function yRange(marks) {
  return (u, min, max) => {
    const vs = marks.map((m) => m.value).filter((v) => Number.isFinite(v));
    let lo = min, hi = max;
    for (const v of vs) { lo = lo === null || lo === undefined || v < lo ? v : lo; hi = hi === null || hi === undefined || v > hi ? v : hi; }
    if (lo === null || lo === undefined) return [0, 1];
    return window.uPlot.rangeNum(lo, hi, 0.1, true);
  };
}

/** A uPlot plugin drawing the markers after the series. */
export function plugin(marks) {
  return {
    hooks: {
      draw: [(u) => {
        const c = u.ctx, r = window.uPlot.pxRatio || 1;
        const [x0, x1] = [u.bbox.left, u.bbox.left + u.bbox.width];
        c.save();
        c.font = Math.round(15 * r) + 'px system-ui, sans-serif';
        c.textAlign = 'center';
        c.textBaseline = 'middle';
        c.lineJoin = 'round';
        let drawn = 0;
        for (const m of marks) {
          const x = u.valToPos(m.t, 'x', true), y = u.valToPos(m.value, 'y', true);
          const outside = x < x0 - 1 || x > x1 + 1 || y < u.bbox.top - 1 || y > u.bbox.top + u.bbox.height + 1;
          if (!Number.isFinite(x) || !Number.isFinite(y) || outside) continue;
          drawn++;
          const k = MARK[kind(m)];
          const glyph = m.below ? MARK.below.glyph : k.glyph;
          c.lineWidth = 3 * r;
          c.strokeStyle = '#ffffff';
          c.strokeText(glyph, x, y);
          c.fillStyle = k.colour;
          c.fillText(glyph, x, y);
        }
        c.restore();
        document.body.dataset.labmarksDrawn = String(drawn); // inside the plot, for the browser test
      }],
    },
  };
}

/** The key and the list under the chart; the newest first, at most 12 listed. */
export function list(marks, unitCode) {
  const target = $('trend-lab');
  if (!target) return;
  document.body.dataset.labmarks = String(marks.length);
  const u = unit(unitCode);
  if (!marks.length) {
    target.replaceChildren(el('p', { class: 'note' }, 'No grab or lab result of this parameter in this window.'));
    return;
  }
  const key = el('p', { class: 'note labkey' },
    ...['lab', 'grab', 'below'].map((k) => el('span', { class: 'labkey-item' },
      el('span', { class: 'mark mark-' + k, 'aria-hidden': 'true' }, MARK[k].glyph), ' ' + MARK[k].word)));
  const shown = marks.slice().sort((a, b) => b.t - a.t).slice(0, 12);
  const items = shown.map((m) => el('li', { 'data-source': m.source, 'data-below': m.below ? 'yes' : 'no' },
    el('span', { class: 'mark mark-' + kind(m), 'aria-hidden': 'true' }, m.below ? MARK.below.glyph : MARK[kind(m)].glyph),
    ' ' + when(new Date(m.t * 1000).toISOString()) + ': ' + (m.below ? '< ' : '') + sig(m.value) + ' ' + u + ' (' + MARK[kind(m)].word
      + (m.below ? ', below the detection limit' : '') + (m.sampleId ? ', sample ' + m.sampleId : '') + ')'));
  const more = marks.length - shown.length;
  target.replaceChildren(key,
    el('ul', { class: 'plain labmarks', 'aria-label': 'Grab and lab results in this window' }, items),
    ...(more > 0 ? [el('p', { class: 'note' }, more + ' older results in this window are drawn but not listed.')] : []));
}

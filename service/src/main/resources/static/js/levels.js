// The level code of Kwanta (docs/level-code.md): a glyph, a word and a colour for every level, so
// a level reads without colour (greyscale print, colour-blind readers) and without hovering.
'use strict';
import { el } from './dom.js';

/** Order of urgency, lowest first. */
export const LEVELS = ['NORMAL', 'OUTSIDE_NORMAL', 'AL1', 'AL2', 'AL3', 'SHUTDOWN'];
export const rank = (level) => Math.max(0, LEVELS.indexOf(level));

export const CODE = {
  NORMAL: { glyph: '○', word: 'normal', say: 'normal' },
  OUTSIDE_NORMAL: { glyph: '◇', word: 'outside normal', say: 'outside the normal range, advisory, not an action level' },
  AL1: { glyph: '▲', word: 'AL1', say: 'action level 1' },
  AL2: { glyph: '◆', word: 'AL2', say: 'action level 2' },
  AL3: { glyph: '■', word: 'AL3', say: 'action level 3' },
  SHUTDOWN: { glyph: '✖', word: 'SHUTDOWN', say: 'shutdown level' },
};
export const DOUBT = { glyph: '?', word: 'instrument in doubt', say: 'instrument in doubt, the level stands' };
export const STALE = { glyph: '◷', word: 'stale', say: 'no evaluation for more than 15 minutes' };

/** A level badge: glyph and word visible, the full meaning for screen readers. */
export function badge(level, inDoubt, extra) {
  const c = CODE[level] || CODE.NORMAL;
  return el('span', { class: 'lvl lvl-' + level.toLowerCase().replace('_', '-') + (inDoubt ? ' doubt' : ''), role: 'img',
    'aria-label': c.say + (inDoubt ? ', ' + DOUBT.say : '') + (extra ? ', ' + extra : '') },
  el('span', { class: 'glyph', 'aria-hidden': 'true' }, c.glyph),
  el('span', { 'aria-hidden': 'true' }, c.word + (extra ? ' ' + extra : '')),
  inDoubt ? el('span', { class: 'doubt-mark', 'aria-hidden': 'true' }, DOUBT.glyph) : null);
}

/** The legend, one for the whole page (the same code is documented for the dashboards). */
export function legend() {
  return el('ul', { class: 'legend-list', 'aria-label': 'Level code' },
    LEVELS.map((l) => el('li', {}, badge(l, false), ' ', el('span', { class: 'legend-say' }, CODE[l].say))),
    el('li', {}, el('span', { class: 'lvl lvl-al1 doubt' }, el('span', { class: 'glyph' }, CODE.AL1.glyph), 'AL1',
      el('span', { class: 'doubt-mark' }, DOUBT.glyph)), ' ', el('span', { class: 'legend-say' }, 'dashed frame and ?: ' + DOUBT.say)),
    el('li', {}, el('span', { class: 'stale-mark' }, STALE.glyph + ' stale'), ' ', el('span', { class: 'legend-say' }, STALE.say)));
}

/**
 * The margin check table: one row per station and spacecraft, from the
 * margin stage when it ran; otherwise a short note that no check was made.
 */
import { esc } from './escape.js';
import { MARGIN_ROWS_LIMIT } from './bounds.js';

export interface MarginRow {
  station: string;
  spacecraft: string;
  /** Margin at the lowest elevation the mask allows, dB. */
  maskMarginDb: number;
  /** Lowest margin seen over the plan's contacts, dB. */
  worstSeenMarginDb: number;
  pass: boolean;
  /** A pair with no contact in the span: neither pass nor fail. */
  notVisible?: boolean;
}

const db = (v: number) => (Number.isFinite(v) ? v.toFixed(1) : '-');

export function renderMarginsSection(margins: readonly MarginRow[] | undefined): string {
  if (!margins || margins.length === 0) {
    return '<p class="note">No margin check was run with this plan.</p>';
  }
  const failed = margins.filter((m) => !m.pass && !m.notVisible).length;
  // bounded: past MARGIN_ROWS_LIMIT pairs, the failures first, then the rest in order
  const listed =
    margins.length > MARGIN_ROWS_LIMIT ? [...margins.filter((m) => !m.pass && !m.notVisible), ...margins.filter((m) => m.pass || m.notVisible)].slice(0, MARGIN_ROWS_LIMIT) : margins;
  const rows = listed.map(
    (m) =>
      `<tr><td>${esc(m.station)}</td><td>${esc(m.spacecraft)}</td><td>${db(m.maskMarginDb)}</td><td>${db(m.worstSeenMarginDb)}</td>` +
      (m.notVisible ? '<td>not visible</td></tr>' : `<td class="${m.pass ? 'pass' : 'fail'}">${m.pass ? 'pass' : 'FAIL'}</td></tr>`),
  );
  return [
    `<p class="note">${margins.length} pair${margins.length === 1 ? '' : 's'} checked, ${failed} failed.${listed.length < margins.length ? ` The first ${listed.length} are listed, failures first; margin.json (passbudget margin) has every pair.` : ''}</p>`,
    '<table class="margins"><thead><tr><th>station</th><th>spacecraft</th><th>margin at mask, dB</th><th>worst seen, dB</th><th>result</th></tr></thead>',
    `<tbody>${rows.join('\n')}</tbody></table>`,
  ].join('\n');
}

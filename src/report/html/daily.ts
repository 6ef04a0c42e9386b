/**
 * Daily volume per station: a small bar chart per station (bars: class
 * "day-bar", data-station, data-day, data-volume-bits, a <title>) and the same
 * figures as a table (cells: class "day-cell" with the same data attributes).
 * Each panel has its own scale, labelled; bars carry their value as text.
 */
import type { DailyRow, DayMode } from '../../plan/daily.js';
import type { PlanResult } from '../../plan/types.js';
import { formatDuration } from '../../time/format.js';
import { formatBits } from '../table.js';
import { niceStep } from './axis.js';
import { esc, px } from './escape.js';

const W = 380;
const H = 186;
const LEFT = 44;
const RIGHT = 6;
const TOP = 18;
const BOTTOM = 50;

const WEEKDAYS = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];

/** Weekday of a calendar date "YYYY-MM-DD" (the date itself, whatever its zone). */
function weekday(day: string): string {
  return WEEKDAYS[new Date(`${day}T12:00:00Z`).getUTCDay()] ?? '';
}

/** Short volume text for a bar label, three significant digits: "470G", "64.7G", "5.96T". */
function shortBits(bits: number): string {
  if (bits === 0) return '0';
  const units: [number, string][] = [
    [1e12, 'T'],
    [1e9, 'G'],
    [1e6, 'M'],
    [1e3, 'k'],
  ];
  const [scale, name] = units.find(([u]) => bits >= u) ?? [1, 'b'];
  const v = bits / scale;
  return `${v >= 100 ? v.toFixed(0) : v >= 10 ? v.toFixed(1) : v.toFixed(2)}${name}`;
}

function stationPanel(stationId: string, stationName: string, rows: readonly DailyRow[], mode: DayMode): string {
  const plotW = W - LEFT - RIGHT;
  const plotH = H - TOP - BOTTOM;
  const maxBits = Math.max(0, ...rows.map((r) => r.volumeBits));
  const unit = maxBits >= 1e12 ? 1e12 : maxBits >= 1e9 ? 1e9 : 1e6;
  const unitName = unit === 1e12 ? 'Tbit' : unit === 1e9 ? 'Gbit' : 'Mbit';
  const step = niceStep(maxBits / unit, 4);
  const top = maxBits > 0 ? Math.ceil(maxBits / unit / step) * step : 1;
  const y = (bits: number) => TOP + plotH - (bits / unit / top) * plotH;
  const slot = plotW / Math.max(1, rows.length);
  const barW = Math.min(30, slot * 0.62);
  const zone = rows[0]?.timeZone ?? 'UTC';
  const out: string[] = [];
  const titleId = `daily-${esc(stationId)}`;
  out.push(
    `<svg viewBox="0 0 ${W} ${H}" role="img" aria-labelledby="${titleId}">`,
    `<title id="${titleId}">Daily volume at ${esc(stationName)} (${esc(stationId)}), ${mode.kind === 'utc' ? 'UTC days' : `local days in ${esc(zone)}`}</title>`,
  );
  for (let v = 0; v <= top + 1e-9; v += step) {
    const yy = px(y(v * unit));
    out.push(`<line class="grid" x1="${LEFT}" y1="${yy}" x2="${W - RIGHT}" y2="${yy}"/>`);
    out.push(`<text x="${LEFT - 5}" y="${px(y(v * unit) + 3.5)}" text-anchor="end">${Number(v.toFixed(3))}</text>`);
  }
  out.push(`<text x="4" y="11">${unitName}</text>`);
  rows.forEach((r, i) => {
    const cx = LEFT + slot * (i + 0.5);
    const y0 = y(r.volumeBits);
    const h = TOP + plotH - y0;
    const flags = [r.dstChange ? `${r.dayHours}-hour day (daylight-saving change)` : '', r.partial ? 'day only partly inside the span' : '']
      .filter(Boolean)
      .join('; ');
    const title = `${stationId} ${r.day}${mode.kind === 'local' ? ` (${r.timeZone})` : ' (UTC)'}: ${formatBits(r.volumeBits)}, ${r.contactCount} contact${r.contactCount === 1 ? '' : 's'} starting, ${formatDuration(r.contactTimeS)} in contact${flags ? `; ${flags}` : ''}`;
    out.push(
      `<rect class="day-bar${r.dstChange ? ' dst' : ''}" x="${px(cx - barW / 2)}" y="${px(y0)}" width="${px(barW)}" height="${px(h)}" ` +
        `data-station="${esc(r.stationId)}" data-day="${r.day}" data-volume-bits="${r.volumeBits}"><title>${esc(title)}</title></rect>`,
    );
    out.push(`<text class="val" x="${px(cx)}" y="${px(y0 - 4)}" text-anchor="middle">${shortBits(r.volumeBits)}</text>`);
    out.push(`<text x="${px(cx)}" y="${H - BOTTOM + 14}" text-anchor="middle">${weekday(r.day)}</text>`);
    out.push(`<text x="${px(cx)}" y="${H - BOTTOM + 27}" text-anchor="middle">${r.day.slice(8)}${r.partial ? '~' : ''}</text>`);
    if (r.dstChange) out.push(`<text class="flag" x="${px(cx)}" y="${H - BOTTOM + 41}" text-anchor="middle">${r.dayHours} h</text>`);
  });
  out.push(`<line class="axis" x1="${LEFT}" y1="${TOP + plotH}" x2="${W - RIGHT}" y2="${TOP + plotH}"/>`);
  out.push('</svg>');
  return out.join('\n');
}

export function renderDailySection(plan: PlanResult, rows: readonly DailyRow[], mode: DayMode): string {
  const parts: string[] = [];
  parts.push('<div class="panels">');
  for (const st of plan.stations) {
    const mine = rows.filter((r) => r.stationId === st.id);
    const zone = mode.kind === 'utc' ? 'UTC days' : `local days, ${st.timeZone}`;
    parts.push(`<div class="panel"><h3>${esc(st.id)} <span class="meta">${esc(st.name)} · ${esc(zone)}</span></h3>`);
    parts.push(stationPanel(st.id, st.name, mine, mode));
    parts.push('</div>');
  }
  parts.push('</div>');
  // the same figures as a table
  const days = [...new Set(rows.map((r) => r.day))].sort();
  const cell = new Map(rows.map((r) => [`${r.stationId}|${r.day}`, r]));
  parts.push('<div class="scroll"><table class="daily"><thead><tr>');
  parts.push(`<th>${mode.kind === 'utc' ? 'day (UTC)' : 'day (station local)'}</th>`);
  for (const st of plan.stations) parts.push(`<th scope="col">${esc(st.id)}</th>`);
  parts.push('</tr></thead><tbody>');
  for (const day of days) {
    parts.push(`<tr><th scope="row">${weekday(day)} ${day}</th>`);
    for (const st of plan.stations) {
      const r = cell.get(`${st.id}|${day}`);
      if (!r) {
        parts.push('<td></td>');
        continue;
      }
      const flag = r.dstChange ? ` <span class="flag" title="${r.dayHours}-hour day">${r.dayHours} h</span>` : '';
      parts.push(
        `<td class="day-cell" data-station="${esc(r.stationId)}" data-day="${r.day}" data-volume-bits="${r.volumeBits}">` +
          `${formatBits(r.volumeBits)} <span class="meta">(${r.contactCount})</span>${r.partial ? '~' : ''}${flag}</td>`,
      );
    }
    parts.push('</tr>');
  }
  parts.push('</tbody></table></div>');
  return parts.join('\n');
}

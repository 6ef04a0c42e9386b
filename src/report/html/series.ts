/**
 * One chosen contact as two stacked SVG panels sharing the time axis:
 * elevation (deg) above, data rate (Mbit/s, kbit/s or bit/s) below, from a ContactSeries.
 */
import type { ContactSeries } from '../../plan/series.js';
import type { Contact, PlanResult } from '../../plan/types.js';
import { isoUtc, formatDuration } from '../../time/format.js';
import { formatBits } from '../table.js';
import { niceStep, timeStepMs } from './axis.js';
import { dayLabelUtc, esc, hhmmUtc, px } from './escape.js';

const W = 580;
const LEFT = 46;
const RIGHT = 10;
const PANEL_H = 78;
const GAP = 22;
const TOP = 14;
const BOTTOM = 30;
const H = TOP + PANEL_H + GAP + PANEL_H + BOTTOM;

function polyline(series: ContactSeries, x: (t: number) => number, y: (v: number) => number, values: Float64Array): string {
  const pts: string[] = [];
  for (let i = 0; i < series.tMs.length; i++) pts.push(`${px(x(series.tMs[i]!))},${px(y(values[i]!))}`);
  return pts.join(' ');
}

function chart(s: ContactSeries, hueClass: string, idBase: string): string {
  const t0 = s.aosMs;
  const t1 = Math.max(s.losMs, t0 + 1000);
  const plotW = W - LEFT - RIGHT;
  const x = (t: number) => LEFT + ((t - t0) / (t1 - t0)) * plotW;
  const maxEl = Math.max(0, ...s.elevationDeg);
  const elStep = niceStep(maxEl, 3);
  const elTop = Math.max(elStep, Math.ceil(maxEl / elStep) * elStep);
  const yEl = (v: number) => TOP + PANEL_H - (Math.max(0, v) / elTop) * PANEL_H;
  const maxRateBps = Math.max(0, ...s.rateBps);
  const [rUnit, rUnitName] = maxRateBps >= 1e6 ? [1e6, 'Mbit/s'] : maxRateBps >= 1e3 ? [1e3, 'kbit/s'] : [1, 'bit/s'];
  const maxRate = maxRateBps / rUnit;
  const rStep = niceStep(maxRate, 3);
  // headroom: a flat top (fixed-rate codes) should not touch the panel's upper edge
  const rTop = maxRate > 0 ? Math.ceil((maxRate * 1.08) / rStep) * rStep : 1;
  const rBase = TOP + PANEL_H + GAP + PANEL_H;
  const yR = (bps: number) => rBase - (bps / rUnit / rTop) * PANEL_H;
  const out: string[] = [];
  out.push(
    `<svg viewBox="0 0 ${W} ${H}" role="img" aria-labelledby="${idBase}-t">`,
    `<title id="${idBase}-t">Elevation and data rate of ${esc(s.spacecraftId)} over ${esc(s.stationId)} from ${esc(isoUtc(s.aosMs, 0))}</title>`,
  );
  // horizontal grid and y labels
  for (let v = 0; v <= elTop + 1e-9; v += elStep) {
    out.push(`<line class="grid" x1="${LEFT}" y1="${px(yEl(v))}" x2="${W - RIGHT}" y2="${px(yEl(v))}"/>`);
    out.push(`<text x="${LEFT - 5}" y="${px(yEl(v) + 3.5)}" text-anchor="end">${Number(v.toFixed(2))}</text>`);
  }
  for (let v = 0; v <= rTop + 1e-9; v += rStep) {
    const yy = rBase - (v / rTop) * PANEL_H;
    out.push(`<line class="grid" x1="${LEFT}" y1="${px(yy)}" x2="${W - RIGHT}" y2="${px(yy)}"/>`);
    out.push(`<text x="${LEFT - 5}" y="${px(yy + 3.5)}" text-anchor="end">${Number(v.toFixed(3))}</text>`);
  }
  // time ticks
  const stepMs = timeStepMs(t1 - t0, 6);
  const long = t1 - t0 > 86_400_000;
  for (let t = Math.ceil(t0 / stepMs) * stepMs; t <= t1; t += stepMs) {
    const xx = px(x(t));
    out.push(`<line class="grid" x1="${xx}" y1="${TOP}" x2="${xx}" y2="${rBase}"/>`);
    const label = long ? (t % 86_400_000 === 0 ? dayLabelUtc(t) : hhmmUtc(t)) : hhmmUtc(t);
    // a label centred on the right edge would be cut off; the gridline stays
    if (x(t) <= W - RIGHT - 4 * label.length) out.push(`<text x="${xx}" y="${rBase + 14}" text-anchor="middle">${label}</text>`);
  }
  out.push(`<text x="${W - RIGHT}" y="${H - 3}" text-anchor="end">UTC</text>`);
  // data start marker
  if (s.dataStartMs > s.aosMs) {
    const xd = px(x(s.dataStartMs));
    out.push(`<line class="axis" stroke-dasharray="3 3" x1="${xd}" y1="${TOP + PANEL_H + GAP}" x2="${xd}" y2="${rBase}"><title>data start (AOS + acquisition time)</title></line>`);
  }
  // rate area and elevation line
  if (s.tMs.length > 0) {
    const first = px(x(s.tMs[0]!));
    const last = px(x(s.tMs[s.tMs.length - 1]!));
    out.push(`<polygon class="${hueClass}" fill-opacity="0.85" points="${first},${px(rBase)} ${polyline(s, x, yR, s.rateBps)} ${last},${px(rBase)}"/>`);
    out.push(`<polyline class="elev" points="${polyline(s, x, yEl, s.elevationDeg)}"/>`);
  }
  out.push(`<line class="axis" x1="${LEFT}" y1="${px(yEl(0))}" x2="${W - RIGHT}" y2="${px(yEl(0))}"/>`);
  out.push(`<line class="axis" x1="${LEFT}" y1="${px(rBase)}" x2="${W - RIGHT}" y2="${px(rBase)}"/>`);
  out.push(`<text class="lbl" x="${LEFT + 4}" y="${TOP - 3}">elevation, deg</text>`);
  out.push(`<text class="lbl" x="${LEFT + 4}" y="${TOP + PANEL_H + GAP - 3}">data rate, ${rUnitName}</text>`);
  out.push('</svg>');
  return out.join('\n');
}

export function renderSeriesSection(plan: PlanResult, series: readonly ContactSeries[], caption: (s: ContactSeries) => string): string {
  if (series.length === 0) return '<p class="note">No contact with a computed link in this plan.</p>';
  const scIndex = new Map(plan.spacecraft.map((s, i) => [s.id, i]));
  // the charted contacts looked up once (a find per chart over a million contacts is slow)
  const key = (stationId: string, spacecraftId: string, aosMs: number): string => `${stationId}|${spacecraftId}|${aosMs}`;
  const wanted = new Set(series.map((s) => key(s.stationId, s.spacecraftId, s.aosMs)));
  const charted = new Map<string, Contact>();
  for (const c of plan.contacts) {
    const k = key(c.stationId, c.spacecraftId, c.aosMs);
    if (wanted.has(k) && !charted.has(k)) charted.set(k, c);
  }
  const contactOf = (s: ContactSeries): Contact | undefined => charted.get(key(s.stationId, s.spacecraftId, s.aosMs));
  const parts = ['<div class="cards">'];
  series.forEach((s, i) => {
    const c = contactOf(s);
    const li = (scIndex.get(s.spacecraftId) ?? 0) % 8;
    parts.push(`<div class="card"><h3><span class="swatch bg-sc${li}"></span>${esc(s.spacecraftId)} over ${esc(s.stationId)}</h3>`);
    const facts = [
      esc(caption(s)),
      `${esc(isoUtc(s.aosMs, 0))} to ${esc(isoUtc(s.losMs, 0))}`,
      c ? `${formatDuration(c.durationS)}, max elevation ${c.maxElevationDeg.toFixed(1)} deg` : '',
      c?.link ? `${formatBits(c.link.volumeBits)}, worst margin ${c.link.worstMarginDb.toFixed(1)} dB` : '',
      `sampled every ${s.stepS} s`,
    ].filter(Boolean);
    parts.push(`<p class="meta">${facts.join(' · ')}</p>`);
    parts.push(chart(s, `sc${li}`, `series-${i}`));
    parts.push('</div>');
  });
  parts.push('</div>');
  return parts.join('\n');
}

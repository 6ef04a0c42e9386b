/**
 * The week's contacts as an SVG timeline: one block per station, one lane per
 * spacecraft inside it, one rect per contact (class "contact-bar", data-station,
 * data-spacecraft, data-volume-bits, a <title> for the tooltip and screen
 * readers). Time runs left to right over the span, with UTC day lines.
 */
import type { PlanResult } from '../../plan/types.js';
import { isoUtc, formatDuration } from '../../time/format.js';
import { formatBits } from '../table.js';
import { dayLabelUtc, esc, px } from './escape.js';

const WIDTH = 1192;
const LABEL_W = 150;
const RIGHT_PAD = 10;
const AXIS_H = 24;
const LANE_H = 6;
const LANE_GAP = 2;
const BLOCK_PAD = 8;
const MIN_BAR_W = 1.5;
const DAY_MS = 86_400_000;

/**
 * Above this many contacts the timeline shows one bar per station and UTC day (its
 * contact count and volume) instead of one per contact, and says so: a bar per contact
 * of a thousand-spacecraft fleet would make a page of hundreds of megabytes.
 */
export const TIMELINE_CONTACT_LIMIT = 20_000;

export function renderTimeline(plan: PlanResult): string {
  if (plan.contacts.length > TIMELINE_CONTACT_LIMIT) return renderDayAggregates(plan);
  const { startMs, endMs } = plan.span;
  const plotW = WIDTH - LABEL_W - RIGHT_PAD;
  const x = (t: number) => LABEL_W + ((Math.min(Math.max(t, startMs), endMs) - startMs) / (endMs - startMs)) * plotW;
  const scIndex = new Map(plan.spacecraft.map((s, i) => [s.id, i]));
  const nLanes = Math.max(1, plan.spacecraft.length);
  const blockH = nLanes * (LANE_H + LANE_GAP) - LANE_GAP + 2 * BLOCK_PAD;
  const height = AXIS_H + plan.stations.length * blockH + 4;
  const out: string[] = [];
  out.push(
    `<svg viewBox="0 0 ${WIDTH} ${height}" role="img" aria-labelledby="tl-title tl-desc">`,
    `<title id="tl-title">Contact timeline per station</title>`,
    `<desc id="tl-desc">${plan.contacts.length} contacts from ${esc(isoUtc(startMs, 0))} to ${esc(isoUtc(endMs, 0))}; one lane per spacecraft in each station's block.</desc>`,
  );
  // station bands (alternate) and labels
  plan.stations.forEach((st, i) => {
    const y0 = AXIS_H + i * blockH;
    if (i % 2 === 0) out.push(`<rect class="band" x="0" y="${y0}" width="${WIDTH}" height="${blockH}"/>`);
    out.push(`<text class="lbl" x="8" y="${y0 + blockH / 2 - 2}">${esc(st.id)}</text>`);
    out.push(`<text x="8" y="${y0 + blockH / 2 + 12}">${esc(st.name)}</text>`);
  });
  // day lines and labels
  const firstDay = Math.ceil(startMs / DAY_MS) * DAY_MS;
  for (let t = firstDay; t <= endMs; t += DAY_MS) {
    const xd = px(x(t));
    out.push(`<line class="grid" x1="${xd}" y1="${AXIS_H - 6}" x2="${xd}" y2="${height - 4}"/>`);
    if (t + DAY_MS / 2 <= endMs) out.push(`<text x="${px(x(t + DAY_MS / 2))}" y="${AXIS_H - 10}" text-anchor="middle">${dayLabelUtc(t)}</text>`);
  }
  out.push(`<line class="axis" x1="${LABEL_W}" y1="${AXIS_H - 6}" x2="${LABEL_W}" y2="${height - 4}"/>`);
  // contacts
  const stIndex = new Map(plan.stations.map((s, i) => [s.id, i]));
  for (const c of plan.contacts) {
    const si = stIndex.get(c.stationId);
    const li = scIndex.get(c.spacecraftId);
    if (si === undefined || li === undefined) continue;
    const y = AXIS_H + si * blockH + BLOCK_PAD + li * (LANE_H + LANE_GAP);
    const x0 = x(c.aosMs);
    const w = Math.max(MIN_BAR_W, x(c.losMs) - x0);
    const bits = c.link?.volumeBits ?? 0;
    const title =
      `${c.spacecraftId} over ${c.stationId}: ${isoUtc(c.aosMs, 0)} to ${isoUtc(c.losMs, 0)} ` +
      `(${formatDuration(c.durationS)}), max elevation ${c.maxElevationDeg.toFixed(1)} deg` +
      (c.link ? `, ${formatBits(bits)}` : ', no link computed');
    out.push(
      `<rect class="contact-bar sc${li % 8}" x="${px(x0)}" y="${y}" width="${px(w)}" height="${LANE_H}" ` +
        `data-station="${esc(c.stationId)}" data-spacecraft="${esc(c.spacecraftId)}" data-volume-bits="${bits}"><title>${esc(title)}</title></rect>`,
    );
  }
  out.push('</svg>');
  return out.join('\n');
}

const AGG_BLOCK_H = 26;

/** The timeline as one bar per station and UTC day (bar height: that day's share of the busiest station-day's contact time). */
function renderDayAggregates(plan: PlanResult): string {
  const { startMs, endMs } = plan.span;
  const plotW = WIDTH - LABEL_W - RIGHT_PAD;
  const x = (t: number) => LABEL_W + ((Math.min(Math.max(t, startMs), endMs) - startMs) / (endMs - startMs)) * plotW;
  const height = AXIS_H + plan.stations.length * AGG_BLOCK_H + 4;
  const stIndex = new Map(plan.stations.map((s, i) => [s.id, i]));
  const days = Math.max(1, Math.ceil((endMs - Math.floor(startMs / DAY_MS) * DAY_MS) / DAY_MS));
  const day0 = Math.floor(startMs / DAY_MS) * DAY_MS;
  const n = plan.stations.length * days;
  const count = new Float64Array(n);
  const timeS = new Float64Array(n);
  const bits = new Float64Array(n);
  for (const c of plan.contacts) {
    const si = stIndex.get(c.stationId);
    if (si === undefined) continue;
    const d = Math.min(days - 1, Math.max(0, Math.floor((c.aosMs - day0) / DAY_MS)));
    const k = si * days + d;
    count[k]! += 1;
    timeS[k]! += c.durationS;
    bits[k]! += c.link?.volumeBits ?? 0;
  }
  let busiest = 0;
  for (const t of timeS) busiest = Math.max(busiest, t);
  const out: string[] = [
    `<p class="note">${plan.contacts.length} contacts: more than ${TIMELINE_CONTACT_LIMIT}, so the timeline shows one bar per station and UTC day (contacts counted on their AOS day; bar height: contact time against the busiest station-day) instead of one bar per contact. contacts.csv lists every contact.</p>`,
    `<svg viewBox="0 0 ${WIDTH} ${height}" role="img" aria-labelledby="tl-title tl-desc">`,
    `<title id="tl-title">Contacts per station and day</title>`,
    `<desc id="tl-desc">${plan.contacts.length} contacts from ${esc(isoUtc(startMs, 0))} to ${esc(isoUtc(endMs, 0))}, one bar per station and UTC day.</desc>`,
  ];
  plan.stations.forEach((st, i) => {
    const y0 = AXIS_H + i * AGG_BLOCK_H;
    if (i % 2 === 0) out.push(`<rect class="band" x="0" y="${y0}" width="${WIDTH}" height="${AGG_BLOCK_H}"/>`);
    out.push(`<text class="lbl" x="8" y="${y0 + AGG_BLOCK_H / 2 + 4}">${esc(st.id)}</text>`);
    for (let d = 0; d < days; d++) {
      const k = i * days + d;
      if (count[k] === 0) continue;
      const a = Math.max(startMs, day0 + d * DAY_MS);
      const b = Math.min(endMs, day0 + (d + 1) * DAY_MS);
      const h = Math.max(1, ((AGG_BLOCK_H - 6) * timeS[k]!) / Math.max(busiest, 1));
      const title = `${st.id} on ${dayLabelUtc(day0 + d * DAY_MS)}: ${count[k]} contacts, contact time ${formatDuration(timeS[k]!)}, ${formatBits(bits[k]!)}`;
      out.push(
        `<rect class="contact-day sc${i % 8}" x="${px(x(a) + 1)}" y="${px(y0 + AGG_BLOCK_H - 3 - h)}" width="${px(Math.max(MIN_BAR_W, x(b) - x(a) - 2))}" height="${px(h)}" ` +
          `data-station="${esc(st.id)}" data-contacts="${count[k]}" data-volume-bits="${bits[k]}"><title>${esc(title)}</title></rect>`,
      );
    }
  });
  for (let t = Math.ceil(startMs / DAY_MS) * DAY_MS; t <= endMs; t += DAY_MS) {
    const xd = px(x(t));
    out.push(`<line class="grid" x1="${xd}" y1="${AXIS_H - 6}" x2="${xd}" y2="${height - 4}"/>`);
    if (t + DAY_MS / 2 <= endMs) out.push(`<text x="${px(x(t + DAY_MS / 2))}" y="${AXIS_H - 10}" text-anchor="middle">${dayLabelUtc(t)}</text>`);
  }
  out.push('</svg>');
  return out.join('\n');
}

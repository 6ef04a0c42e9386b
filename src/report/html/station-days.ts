/**
 * The station-day view: one row per station and UTC day, 24 hours wide, every track in it.
 * A contact is drawn in the row of its AOS day (class "sd-contact": the window light, its
 * data part solid) and, when it runs past midnight, continued in the next row ("sd-cont").
 * Above CONTACT_DETAIL_LIMIT contacts a row draws its busy time instead ("sd-busy": the union
 * of its windows), and the section says so.
 */
import type { Contact, PlanResult } from '../../plan/types.js';
import { formatDuration, isoUtc } from '../../time/format.js';
import { formatBits } from '../table.js';
import { CONTACT_DETAIL_LIMIT } from './bounds.js';
import { DAY_MS, dayKey, hhmmssUtc, utcDays } from './days.js';
import { dayLabelUtc, esc, px } from './escape.js';

const MIN_MS = 60_000;
const TRACK_H = 12;

/** Minutes since the day start, clamped to the day. */
const minutes = (tMs: number, dayMs: number) => Math.min(Math.max(tMs - dayMs, 0), DAY_MS) / MIN_MS;

function mergedIntervals(list: readonly Contact[], dayMs: number): [number, number][] {
  const iv = list.map((c) => [Math.max(c.aosMs, dayMs), Math.min(c.losMs, dayMs + DAY_MS)] as [number, number]).filter(([a, b]) => b > a);
  iv.sort((a, b) => a[0] - b[0]);
  const out: [number, number][] = [];
  for (const [a, b] of iv) {
    const last = out[out.length - 1];
    if (last && a <= last[1]) last[1] = Math.max(last[1], b);
    else out.push([a, b]);
  }
  return out;
}

export function renderStationDays(plan: PlanResult): string {
  const detailed = plan.contacts.length <= CONTACT_DETAIL_LIMIT;
  const days = utcDays(plan.span.startMs, plan.span.endMs);
  const scIndex = new Map(plan.spacecraft.map((s, i) => [s.id, i]));
  // contacts touching each station-day
  const touching = new Map<string, Contact[]>();
  const aosDay = new Map<string, number>();
  for (const c of plan.contacts) {
    for (let d = Math.floor(c.aosMs / DAY_MS) * DAY_MS; d < c.losMs; d += DAY_MS) {
      const key = `${c.stationId}|${d}`;
      let l = touching.get(key);
      if (!l) touching.set(key, (l = []));
      l.push(c);
    }
    const k = `${c.stationId}|${Math.floor(c.aosMs / DAY_MS) * DAY_MS}`;
    aosDay.set(k, (aosDay.get(k) ?? 0) + 1);
  }
  const hasLink = plan.contacts.some((c) => c.link !== undefined);
  const hours = Array.from({ length: 8 }, (_, i) => `<span>${String(i * 3).padStart(2, '0')}</span>`).join('');
  const out: string[] = [];
  out.push(
    detailed
      ? `<p class="note">One row per station and UTC day, 00 to 24 h. Light: the window above the mask; solid: the data part (after acquisition, above the minimum data elevation, while the link closes somewhere in it). Colour: the spacecraft. Hover a track for its times, volume and margin.</p>`
      : `<p class="note"><strong>${plan.contacts.length} contacts</strong>: above ${CONTACT_DETAIL_LIMIT} each row shows its busy time (the union of its windows) instead of every track; contacts.csv and plan.json list every contact.</p>`,
  );
  out.push(`<div class="sd"><div class="sd-row sd-axis"><span></span><span></span><div class="sd-hours">${hours}</div><span></span></div>`);
  for (const st of plan.stations) {
    days.forEach((dayMs, di) => {
      const key = `${st.id}|${dayMs}`;
      const list = touching.get(key) ?? [];
      const started = list.filter((c) => c.aosMs >= dayMs && c.aosMs < dayMs + DAY_MS);
      const bits = started.reduce((s, c) => s + (c.link?.volumeBits ?? 0), 0);
      const shapes: string[] = [];
      if (detailed) {
        for (const c of list) {
          const li = (scIndex.get(c.spacecraftId) ?? 0) % 8;
          const own = c.aosMs >= dayMs;
          const x0 = minutes(c.aosMs, dayMs);
          const w = Math.max(0.8, minutes(c.losMs, dayMs) - x0);
          const title =
            `${c.spacecraftId} over ${c.stationId}: ${isoUtc(c.aosMs, 0)} to ${isoUtc(c.losMs, 0)} (${formatDuration(c.durationS)}), max elevation ${c.maxElevationDeg.toFixed(1)} deg` +
            (c.link ? `, data ${hhmmssUtc(c.link.dataStartMs)}-${hhmmssUtc(c.link.dataEndMs)}, ${formatBits(c.link.volumeBits)}, closure margin ${c.link.worstMarginDb.toFixed(1)} dB` : ', no link computed');
          shapes.push(
            `<rect class="${own ? 'sd-contact' : 'sd-cont'} sc${li}" fill-opacity="0.38" x="${px(x0)}" y="1" width="${px(w)}" height="${TRACK_H - 2}"` +
              (own ? ` data-station="${esc(c.stationId)}" data-spacecraft="${esc(c.spacecraftId)}" data-volume-bits="${c.link?.volumeBits ?? 0}"` : '') +
              `><title>${esc(title)}</title></rect>`,
          );
          if (c.link && c.link.volumeBits > 0 && c.link.dataEndMs > c.link.dataStartMs) {
            const d0 = minutes(c.link.dataStartMs, dayMs);
            const dw = minutes(c.link.dataEndMs, dayMs) - d0;
            if (dw > 0) shapes.push(`<rect class="sc${li}" x="${px(d0)}" y="3" width="${px(Math.max(0.6, dw))}" height="${TRACK_H - 6}"/>`);
          }
        }
      } else {
        for (const [a, b] of mergedIntervals(list, dayMs)) {
          shapes.push(`<rect class="sd-busy" x="${px(minutes(a, dayMs))}" y="1" width="${px(Math.max(0.8, minutes(b, dayMs) - minutes(a, dayMs)))}" height="${TRACK_H - 2}"/>`);
        }
      }
      const n = aosDay.get(key) ?? 0;
      const partial = dayMs < plan.span.startMs || dayMs + DAY_MS > plan.span.endMs;
      out.push(
        `<div class="sd-row${di === 0 ? ' sd-first' : ''}" data-station="${esc(st.id)}" data-day="${dayKey(dayMs)}">` +
          `<span class="sd-st">${di === 0 ? `<b>${esc(st.id)}</b> ${esc(st.name)}` : ''}</span><span class="sd-day">${dayLabelUtc(dayMs)}${partial ? ' ~' : ''}</span>` +
          `<svg class="sd-track" viewBox="0 0 1440 ${TRACK_H}" preserveAspectRatio="none" role="img"><title>${esc(st.id)} on ${dayKey(dayMs)}: ${n} contact${n === 1 ? '' : 's'}</title>${shapes.join('')}</svg>` +
          `<span class="sd-sum">${n}${n > 0 && hasLink ? ` · ${formatBits(bits)}` : ''}</span></div>`,
      );
    });
  }
  out.push('</div>');
  return out.join('\n');
}

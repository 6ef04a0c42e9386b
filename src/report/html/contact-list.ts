/**
 * The contact list, grouped per station and UTC day of AOS. Each row leads with what
 * the link gives (data start and end, volume, closure margin, time per MODCOD), then the
 * geometry as a trailing group (AOS, LOS, duration, maximum elevation). Above
 * CONTACT_DETAIL_LIMIT contacts: one row per station-day with its totals, then the
 * TOP_CONTACTS highest-volume contacts, and a line saying so.
 */
import type { Contact, PlanResult } from '../../plan/types.js';
import { formatDuration } from '../../time/format.js';
import { fixed, formatBits } from '../table.js';
import { CONTACT_DETAIL_LIMIT, TOP_CONTACTS } from './bounds.js';
import { DAY_MS, dayKey, hhmmssUtc, utcDays } from './days.js';
import { dayLabelUtc, esc } from './escape.js';

const COLUMNS = 10;

function modcodText(c: Contact): string {
  if (!c.link) return '-';
  const entries = Object.entries(c.link.timeInModcodS)
    .filter(([, s]) => s > 0)
    .sort((a, b) => b[1] - a[1]);
  if (entries.length === 0) return 'none closes';
  const [name, s] = entries[0]!;
  return `${esc(name)} ${formatDuration(s)}` + (entries.length > 1 ? ` <span class="more">+${entries.length - 1} more</span>` : '');
}

function marginCell(c: Contact): string {
  if (!c.link) return '<td>-</td>';
  const m = c.link.worstMarginDb;
  return `<td class="${m < 0 ? 'fail' : ''}">${fixed(m, 1)}</td>`;
}

/** A row of the list; times carry their date when it is not the group's day (or always, withDate). */
function contactRow(c: Contact, withDate: boolean, groupDayMs = Number.NaN): string {
  const t = (ms: number) => (withDate || Math.floor(ms / DAY_MS) * DAY_MS !== groupDayMs ? `${dayKey(ms).slice(5)} ${hhmmssUtc(ms)}` : hhmmssUtc(ms));
  const l = c.link;
  return (
    `<tr class="contact-row" data-station="${esc(c.stationId)}" data-spacecraft="${esc(c.spacecraftId)}" data-volume-bits="${l?.volumeBits ?? 0}">` +
    `<td>${withDate ? `${esc(c.stationId)} · ` : ''}${esc(c.spacecraftId)}</td><td>${l ? t(l.dataStartMs) : '-'}</td><td>${l ? t(l.dataEndMs) : '-'}</td>` +
    `<td>${l ? formatBits(l.volumeBits) : '-'}</td>${marginCell(c)}<td class="text"${l ? ` title="${esc(Object.entries(l.timeInModcodS).filter(([, x]) => x > 0).sort((a, b) => b[1] - a[1]).map(([n, x]) => `${n} ${formatDuration(x)}`).join(', '))}"` : ''}>${modcodText(c)}</td>` +
    `<td class="geo">${t(c.aosMs)}${c.aosClipped ? '&lt;' : ''}</td><td>${t(c.losMs)}${c.losClipped ? '&gt;' : ''}</td><td>${formatDuration(c.durationS)}</td><td>${c.maxElevationDeg.toFixed(1)}</td></tr>`
  );
}

const HEAD =
  '<thead><tr class="groups"><th colspan="6" class="text">link</th><th colspan="4" class="text geo">geometry</th></tr>' +
  '<tr><th>spacecraft</th><th>data start</th><th>data end</th><th>volume</th><th>closure margin dB</th><th class="text">time per MODCOD</th>' +
  '<th class="geo">AOS</th><th>LOS</th><th>duration</th><th>max el deg</th></tr></thead>';

/**
 * The first `k` items of a stable sort of `items` by `cmp`, without sorting them all (a
 * fleet's contacts are counted in hundreds of thousands, the list shows a few): a sorted
 * window of k kept by insertion, an item placed after its equals as a stable sort would.
 */
export function firstInOrder<T>(items: readonly T[], k: number, cmp: (a: T, b: T) => number): T[] {
  const best: T[] = [];
  if (k <= 0) return best;
  for (const x of items) {
    if (best.length === k && cmp(x, best[k - 1]!) >= 0) continue;
    let lo = 0;
    let hi = best.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (cmp(x, best[mid]!) >= 0) lo = mid + 1;
      else hi = mid;
    }
    best.splice(lo, 0, x);
    if (best.length > k) best.pop();
  }
  return best;
}

export function renderContactList(plan: PlanResult): string {
  const days = utcDays(plan.span.startMs, plan.span.endMs);
  const groups = new Map<string, Contact[]>();
  for (const c of plan.contacts) {
    const key = `${c.stationId}|${Math.floor(c.aosMs / DAY_MS) * DAY_MS}`;
    let g = groups.get(key);
    if (!g) groups.set(key, (g = []));
    g.push(c);
  }
  const names = new Map(plan.stations.map((s) => [s.id, s.name]));
  const note = '<p class="note">Times UTC. Data start / end: after acquisition and above the minimum data elevation. Closure margin: the lowest over the contact. "&lt;" / "&gt;": window cut by the span.</p>';
  if (plan.contacts.length <= CONTACT_DETAIL_LIMIT) {
    const parts = [note, '<div class="scroll"><table class="contacts">', HEAD];
    for (const st of plan.stations) {
      for (const dayMs of days) {
        const g = groups.get(`${st.id}|${dayMs}`);
        if (!g) continue;
        const bits = g.reduce((s, c) => s + (c.link?.volumeBits ?? 0), 0);
        parts.push(
          `<tbody class="group" data-station="${esc(st.id)}" data-day="${dayKey(dayMs)}"><tr class="group-head"><th colspan="${COLUMNS}" class="text">` +
            `${esc(st.id)} ${esc(names.get(st.id) ?? '')} · ${dayLabelUtc(dayMs)} · ${g.length} contact${g.length === 1 ? '' : 's'} · ${formatBits(bits)}</th></tr>`,
        );
        for (const c of g) parts.push(contactRow(c, false, dayMs));
        parts.push('</tbody>');
      }
    }
    parts.push('</table></div>');
    return parts.join('\n');
  }
  // bounded: per station-day totals, then the highest-volume contacts
  const agg: string[] = [];
  for (const st of plan.stations) {
    for (const dayMs of days) {
      const g = groups.get(`${st.id}|${dayMs}`) ?? [];
      const bits = g.reduce((s, c) => s + (c.link?.volumeBits ?? 0), 0);
      const worst = g.reduce((m, c) => Math.min(m, c.link?.worstMarginDb ?? Number.POSITIVE_INFINITY), Number.POSITIVE_INFINITY);
      const time = g.reduce((s, c) => s + c.durationS, 0);
      agg.push(
        `<tr class="agg-row" data-station="${esc(st.id)}" data-day="${dayKey(dayMs)}"><td>${esc(st.id)}</td><td>${dayLabelUtc(dayMs)}</td><td>${g.length}</td>` +
          `<td>${formatBits(bits)}</td><td class="${worst < 0 ? 'fail' : ''}">${fixed(worst, 1)}</td><td>${formatDuration(time)}</td></tr>`,
      );
    }
  }
  const top = firstInOrder(
    plan.contacts.filter((c) => c.link),
    TOP_CONTACTS,
    (a, b) => b.link!.volumeBits - a.link!.volumeBits || a.aosMs - b.aosMs,
  );
  return [
    `<p class="note bound"><strong>${plan.contacts.length} contacts</strong>: above ${CONTACT_DETAIL_LIMIT} the list shows the totals of each station and day and the ${TOP_CONTACTS} highest-volume contacts, not every contact; contacts.csv and plan.json list every one.</p>`,
    '<h3>Per station and day</h3>',
    '<div class="scroll"><table class="contacts-agg"><thead><tr><th>station</th><th class="text">day (UTC)</th><th>contacts</th><th>volume</th><th>worst closure margin dB</th><th>contact time</th></tr></thead>',
    `<tbody>${agg.join('\n')}</tbody></table></div>`,
    `<h3>The ${top.length} highest-volume contacts</h3>`,
    note,
    '<div class="scroll"><table class="contacts top">',
    HEAD.replace('<th>spacecraft</th>', '<th>station · spacecraft</th>'),
    `<tbody>${top.map((c) => contactRow(c, true)).join('\n')}</tbody></table></div>`,
  ].join('\n');
}

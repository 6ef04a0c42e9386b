/**
 * The plan as one self-contained HTML page (out/report.html): inline CSS and
 * SVG drawn here, no scripts, fonts or files from elsewhere, so it opens
 * offline. Sections: header with the span, totals and what needs attention;
 * spacecraft; the station-day view; the contact list per station and day; the
 * passes that matter; daily volume per station; elevation and rate of chosen
 * contacts; margin checks; recorders; warnings; provenance. Bounded in size at
 * any fleet size (bounds.ts). Pure: returns the page as a string, deterministic
 * for the same inputs (no clock).
 */
import type { DailyRow, DayMode, SpacecraftTotal } from '../../plan/daily.js';
import type { ContactSeries } from '../../plan/series.js';
import type { PlanResult } from '../../plan/types.js';
import { isoUtc, formatDuration } from '../../time/format.js';
import { formatBits } from '../table.js';
import { SUN_OUTAGE_BEAMWIDTHS } from '../../geometry/sun-outage.js';
import { renderDailySection } from './daily.js';
import { esc } from './escape.js';
import { renderMarginsSection, type MarginRow } from './margins.js';
import { renderSeriesSection } from './series.js';
import { stylesheet } from './style.js';
import { renderStationDays } from './station-days.js';
import { renderContactList } from './contact-list.js';
import { renderPassViews, type PassView } from './pass-views.js';
import { renderProvenance, type Provenance } from './provenance.js';
import { SERIES_SPACECRAFT_LIMIT } from './bounds.js';

export type { MarginRow } from './margins.js';

export interface ReportInput {
  plan: PlanResult;
  dayMode: DayMode;
  daily: readonly DailyRow[];
  spacecraftTotals: readonly SpacecraftTotal[];
  /** Contacts charted in full (e.g. the highest-volume one per spacecraft). */
  series: readonly ContactSeries[];
  /** What the charted contacts are, one line (default: "highest-volume contact of <spacecraft>"). */
  seriesCaption?: (s: ContactSeries) => string;
  margins?: readonly MarginRow[];
  /** The onboard recorders' fill over time, an SVG drawn by report/recorder.ts (scheduled plans). */
  recorderSvg?: string;
  /** The passes that matter, sampled (plan/series.ts passesThatMatter). */
  passViews?: readonly PassView[];
  /** Data each spacecraft loses: to the antenna schedule, or to a full recorder. */
  losses?: readonly DataLoss[];
  provenance?: Provenance;
}

export interface DataLoss {
  spacecraftId: string;
  offeredBits: number;
  lostBits: number;
  /** "the antenna schedule" or "a full recorder". */
  cause: string;
}

/** Share of its data a spacecraft may lose before the page calls it out. */
const LOSS_ALERT_FRACTION = 0.5;

/** Spacecraft that get nothing, or lose most of their data: [id, why]. */
function attention(input: ReportInput): [string, string][] {
  const out: [string, string][] = [];
  const hasLink = input.plan.contacts.some((c) => c.link);
  for (const t of input.spacecraftTotals) {
    const lostToSchedule = (input.losses ?? []).some((l) => l.spacecraftId === t.spacecraftId && l.cause === 'the antenna schedule' && l.lostBits > 0);
    if (t.contactCount === 0) out.push([t.spacecraftId, lostToSchedule ? 'no window taken: every one lost to the antenna schedule' : 'no contact in the span']);
    else if (hasLink && t.stationSumVolumeBits === 0) out.push([t.spacecraftId, `${t.contactCount} contacts but no data (no radio heard, or the link never closes)`]);
  }
  for (const l of input.losses ?? []) {
    if (l.offeredBits > 0 && l.lostBits / l.offeredBits > LOSS_ALERT_FRACTION && !out.some(([id]) => id === l.spacecraftId)) {
      out.push([l.spacecraftId, `loses ${((100 * l.lostBits) / l.offeredBits).toFixed(0)} % of its data to ${l.cause}`]);
    }
  }
  return out;
}

function attentionBlock(items: readonly [string, string][]): string {
  if (items.length === 0) return '';
  const shown = items.slice(0, 20).map(([id, why]) => `<li><b>${esc(id)}</b>: ${esc(why)}</li>`);
  const more = items.length > 20 ? `<li>and ${items.length - 20} more (marked in the spacecraft table)</li>` : '';
  return `<div class="attention" role="note"><p><strong>Needs attention: ${items.length} spacecraft</strong></p><ul>${shown.join('')}${more}</ul></div>`;
}

/** Headline: volume and contact time counted once per spacecraft radio (unique-volume.ts), station-sum beside. */
function facts(plan: PlanResult, totals: readonly SpacecraftTotal[]): string {
  const hasLink = plan.contacts.some((c) => c.link);
  const onceBits = totals.reduce((s, t) => s + t.volumeBits, 0);
  const sumBits = totals.reduce((s, t) => s + t.stationSumVolumeBits, 0);
  const onceS = totals.reduce((s, t) => s + t.contactTimeS, 0);
  const delivered = totals.some((t) => t.deliveredBits !== undefined) ? totals.reduce((s, t) => s + (t.deliveredBits ?? 0), 0) : undefined;
  const items: [string, string][] = [
    ['contacts', String(plan.contacts.length)],
    ['contact time (counted once)', formatDuration(onceS)],
    [delivered === undefined ? 'volume (counted once)' : 'link capacity (counted once)', hasLink ? formatBits(onceBits) : '-'],
    ...(delivered !== undefined ? ([['delivered (recorders)', formatBits(delivered)]] as [string, string][]) : []),
    ['station-sum volume', hasLink ? formatBits(sumBits) : '-'],
    ['stations', String(plan.stations.length)],
    ['spacecraft', String(plan.spacecraft.length)],
    ['availability', `${plan.availabilityPercent} %`],
  ];
  return `<dl class="facts">${items.map(([k, v]) => `<div><dt>${k}</dt><dd>${esc(v)}</dd></div>`).join('')}</dl>`;
}

function spacecraftTable(plan: PlanResult, totals: readonly SpacecraftTotal[], alerts: readonly [string, string][]): string {
  const idx = new Map(plan.spacecraft.map((s, i) => [s.id, i]));
  const name = new Map(plan.spacecraft.map((s) => [s.id, s.name]));
  const why = new Map(alerts);
  const rows = totals.map((t) => {
    const i = (idx.get(t.spacecraftId) ?? 0) % 8;
    const alert = why.get(t.spacecraftId);
    return (
      `<tr${alert ? ' class="alert"' : ''}><td><span class="swatch bg-sc${i}"></span>${esc(t.spacecraftId)}</td><td class="text">${esc(name.get(t.spacecraftId) ?? '')}</td>` +
      `<td>${t.contactCount}</td><td>${formatDuration(t.contactTimeS)}</td><td data-volume-bits="${t.volumeBits}">${formatBits(t.volumeBits)}</td>` +
      `<td>${formatBits(t.stationSumVolumeBits)}</td><td class="text">${alert ? `<span class="flag">${esc(alert)}</span>` : ''}</td></tr>`
    );
  });
  return [
    '<table class="spacecraft"><thead><tr><th>spacecraft</th><th class="text">name</th><th>contacts</th><th>contact time (union)</th><th>volume (counted once)</th><th>station-sum volume</th><th class="text">attention</th></tr></thead>',
    `<tbody>${rows.join('\n')}</tbody></table>`,
  ].join('\n');
}

export function renderReportHtml(input: ReportInput): string {
  const { plan } = input;
  const span = `${isoUtc(plan.span.startMs, 0)} to ${isoUtc(plan.span.endMs, 0)}`;
  const caption = input.seriesCaption ?? ((s: ContactSeries) => `highest-volume contact of ${s.spacecraftId}`);
  const dayNote =
    input.dayMode.kind === 'utc'
      ? 'UTC days.'
      : "Each station's own local days (23- or 25-hour days at daylight-saving changes are marked).";
  const shownWarnings = plan.warnings.slice(0, 200);
  const warnings = plan.warnings.length
    ? `<section id="warnings"><h2>Warnings</h2><ul class="warnings">${shownWarnings.map((w) => `<li>${esc(w)}</li>`).join('')}${plan.warnings.length > shownWarnings.length ? `<li>and ${plan.warnings.length - shownWarnings.length} more (plan.json lists every one)</li>` : ''}</ul></section>`
    : '';
  const outages = plan.sunOutages ?? [];
  const sunOutages = plan.sunOutages
    ? `<section id="sun-outages"><h2>Sun outages</h2>\n<p class="note">The Sun's limb within ${SUN_OUTAGE_BEAMWIDTHS} half-power beamwidth of the station's boresight; the Sun's noise is already in every volume.</p>\n` +
      (outages.length === 0
        ? '<p>None in the span.</p>'
        : '<table class="outages"><thead><tr><th>station</th><th>spacecraft</th><th>start (UTC)</th><th>end</th><th>closest deg</th><th>Sun noise K</th></tr></thead><tbody>' +
          outages
            .map((o) => `<tr><td>${esc(o.stationId)}</td><td>${esc(o.spacecraftId)}</td><td>${isoUtc(o.startMs, 0)}</td><td>${isoUtc(o.endMs, 0)}</td><td>${o.minOffsetDeg.toFixed(3)}</td><td>${o.peakSunNoiseK.toFixed(0)}</td></tr>`)
            .join('') +
          '</tbody></table>') +
      '\n</section>'
    : '';
  const alerts = attention(input);
  const charted = input.series.slice(0, SERIES_SPACECRAFT_LIMIT);
  const chartNote = charted.length === SERIES_SPACECRAFT_LIMIT && plan.spacecraft.length > charted.length ? ` Shown for the first ${charted.length} of ${plan.spacecraft.length} spacecraft.` : '';
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>Contact plan ${esc(span)}</title>
<style>${stylesheet()}</style>
</head>
<body>
<main>
<header class="top">
<p class="kicker">passbudget · contact plan</p>
<h1>${esc(span)}</h1>
<p class="sub">Link at ${plan.availabilityPercent} % availability, sampled every ${plan.linkStepS} s inside contacts. All times UTC.</p>
${facts(plan, input.spacecraftTotals)}
${attentionBlock(alerts)}
</header>
<section id="spacecraft"><h2>Spacecraft</h2>
<p class="note">Totals over the span; colours mark each spacecraft in the views below.</p>
${spacecraftTable(plan, input.spacecraftTotals, alerts)}
</section>
<section id="station-days"><h2>Station days</h2>
${renderStationDays(plan)}
</section>
<section id="contact-list"><h2>Contacts per station and day</h2>
${renderContactList(plan)}
</section>
<section id="passes"><h2>Passes that matter</h2>
<p class="note">The best (highest volume), the worst closure margin and the longest pass. Sky plot: north up, east right, zenith at the centre; shaded: below the horizon mask; filled points: data flowing.</p>
${renderPassViews(input.passViews ?? [])}
</section>
<section id="daily"><h2>Daily volume per station</h2>
<p class="note">${dayNote} A day's volume is the data received in it; contacts (in brackets) are counted on the day of their AOS. "~": day only partly inside the span.</p>
${renderDailySection(plan, input.daily, input.dayMode)}
</section>
<section id="contacts"><h2>Elevation and data rate</h2>
<p class="note">The highest-volume contact of each spacecraft, re-sampled for the chart; the rate is zero before data start (dashed line) and wherever the link does not close.${chartNote}</p>
${renderSeriesSection(plan, charted, caption)}
</section>
<section id="margins"><h2>Margin checks</h2>
${renderMarginsSection(input.margins)}
</section>
${input.recorderSvg ? `<section id="recorder"><h2>Onboard recorders</h2>\n<p class="note">Fill of each recorder over the span, draining during the scheduled contacts.</p>\n${input.recorderSvg}\n</section>` : ''}
${sunOutages}
${warnings}
${input.provenance ? renderProvenance(input.provenance) : '<footer>Made by passbudget from the scenario files; the same inputs give the same page.</footer>'}
</main>
</body>
</html>
`;
}

/**
 * Renders the onboard-recorder simulation: a terminal summary, the backlog
 * series as CSV (out/recorder.csv), a summary block for plan.json and a
 * standalone SVG chart of the fill over time (out/recorder.svg). Pure: returns
 * strings and plain objects. Fixed rounding, so output is byte-identical.
 */
import { stringify } from 'csv-stringify/sync';
import type { RecorderResult } from '../plan/recorder.js';
import { isoUtc } from '../time/format.js';
import { formatBits, renderTable } from './table.js';
import { GRID, INK, MUTED, RULE, SURFACE, WARN, hueFor } from './html/palette.js';

const SVG_SANS = 'system-ui, "Segoe UI", "Noto Sans", "DejaVu Sans", sans-serif';

const ageText = (s: number | null) => (s === null ? '-' : s >= 3600 ? `${(s / 3600).toFixed(1)} h` : `${(s / 60).toFixed(1)} min`);

export function renderRecorderTable(r: RecorderResult): string {
  if (r.tracks.length === 0) return 'Onboard recorders: none in the scenario.\n';
  const head = `Onboard recorders (drained by ${r.contactsUsed === 'scheduled' ? 'the scheduled windows' : r.contactsUsed === 'booked tracks' ? 'the booked tracks' : 'every contact'}; ${r.stepS} s steps, FIFO, new data refused when full)`;
  const rows = r.tracks.map((t) => [
    t.spacecraftId,
    formatBits(t.capacityBits),
    `${(t.generationBps / 1e6).toFixed(3)} Mbit/s${t.duty ? ` (${t.duty.onS}s on/${t.duty.offS}s off)` : ''}`,
    formatBits(t.generatedBits),
    formatBits(t.downlinkedBits),
    formatBits(t.lostBits),
    formatBits(t.finalBits),
    `${((100 * t.peakBits) / t.capacityBits).toFixed(1)} %`,
    t.firstOverflowMs === null ? '-' : isoUtc(t.firstOverflowMs, 0),
    ageText(t.maxOldestAgeAtDownlinkS),
  ]);
  const table = renderTable(
    [
      { header: 'spacecraft' },
      { header: 'capacity', align: 'right' },
      { header: 'generation', align: 'right' },
      { header: 'generated', align: 'right' },
      { header: 'downlinked', align: 'right' },
      { header: 'lost (full)', align: 'right' },
      { header: 'stored at end', align: 'right' },
      { header: 'peak fill', align: 'right' },
      { header: 'first overflow' },
      { header: 'oldest data at a downlink', align: 'right' },
    ],
    rows,
  );
  return `${head}\n${table}\n`;
}

/** The backlog series: one row per spacecraft per series time. */
export function renderRecorderCsv(r: RecorderResult): string {
  const rows: (string | number)[][] = [];
  for (const t of r.tracks) {
    const s = t.series;
    for (let i = 0; i < s.tMs.length; i++) {
      const age = s.oldestAgeS[i];
      rows.push([
        isoUtc(s.tMs[i]!, 3),
        t.spacecraftId,
        s.storedBits[i]!,
        s.generatedBits[i]!,
        s.downlinkedBits[i]!,
        s.lostBits[i]!,
        age === null || age === undefined ? '' : age.toFixed(0),
      ]);
    }
  }
  return stringify(rows, {
    header: true,
    columns: ['time_utc', 'spacecraft', 'stored_bits', 'generated_bits_cumulative', 'downlinked_bits_cumulative', 'lost_bits_cumulative', 'oldest_age_s'],
  });
}

/** Summary block for plan.json (no series: that is recorder.csv). */
export function recorderJson(r: RecorderResult): Record<string, unknown> {
  return {
    step_s: r.stepS,
    series_step_s: r.seriesStepS,
    contacts_used: r.contactsUsed,
    spacecraft: r.tracks.map((t) => ({
      spacecraft: t.spacecraftId,
      capacity_bits: t.capacityBits,
      generation_bps: t.generationBps,
      duty: t.duty,
      initial_bits: t.initialBits,
      generated_bits: t.generatedBits,
      downlinked_bits: t.downlinkedBits,
      lost_bits: t.lostBits,
      stored_at_end_bits: t.finalBits,
      offered_bits: t.offeredBits,
      peak_bits: t.peakBits,
      peak_utc: isoUtc(t.peakAtMs, 3),
      first_overflow_utc: t.firstOverflowMs === null ? null : isoUtc(t.firstOverflowMs, 3),
      max_oldest_age_at_downlink_s: t.maxOldestAgeAtDownlinkS === null ? null : Number(t.maxOldestAgeAtDownlinkS.toFixed(1)),
      passes: t.passes.map((p) => ({
        station: p.stationId,
        data_start_utc: isoUtc(p.dataStartMs, 3),
        data_end_utc: isoUtc(p.dataEndMs, 3),
        offered_bits: p.offeredBits,
        downlinked_bits: p.downlinkedBits,
        backlog_at_start_bits: p.backlogAtStartBits,
        oldest_age_at_start_s: p.oldestAgeAtStartS === null ? null : Number(p.oldestAgeAtStartS.toFixed(1)),
        backlog_at_end_bits: p.backlogAtEndBits,
      })),
    })),
  };
}

const xml = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

/** Fill of each recorder (percent of its capacity) over the span, one line per spacecraft. */
export function renderRecorderSvg(r: RecorderResult, title = 'Onboard recorder fill'): string {
  const W = 900;
  const H = 320;
  const L = 60;
  const R = 170;
  const T = 30;
  const B = 40;
  const pw = W - L - R;
  const ph = H - T - B;
  const t0 = Math.min(...r.tracks.map((t) => t.series.tMs[0] ?? Infinity));
  const t1 = Math.max(...r.tracks.map((t) => t.series.tMs.at(-1) ?? -Infinity));
  const out: string[] = [];
  out.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}" font-family='${SVG_SANS}' font-size="11">`);
  out.push(`<title>${xml(title)}</title>`);
  // the report's own look: paper ground, horizontal rules only, an open frame, its spacecraft hues
  out.push(`<rect x="0" y="0" width="${W}" height="${H}" fill="${SURFACE}"/>`);
  out.push(`<text x="${L}" y="18" font-size="13" font-weight="600" fill="${INK}">${xml(title)} <tspan fill="${MUTED}" font-weight="400">% of capacity</tspan></text>`);
  if (!(t1 > t0)) {
    out.push(`<text x="${L}" y="${T + 20}" fill="${MUTED}">no recorder in the scenario</text></svg>`);
    return out.join('\n') + '\n';
  }
  const x = (tMs: number) => (L + ((tMs - t0) / (t1 - t0)) * pw).toFixed(1);
  const y = (pct: number) => (T + ph - (pct / 100) * ph).toFixed(1);
  for (const pct of [0, 25, 50, 75, 100]) {
    out.push(`<line x1="${L}" x2="${L + pw}" y1="${y(pct)}" y2="${y(pct)}" stroke="${pct === 0 ? RULE : GRID}"/>`);
    out.push(`<text x="${L - 6}" y="${y(pct)}" text-anchor="end" dominant-baseline="middle" fill="${MUTED}">${pct}</text>`);
  }
  for (let d = t0; d <= t1; d += 86_400_000) {
    out.push(`<line x1="${x(d)}" x2="${x(d)}" y1="${T + ph}" y2="${T + ph + 4}" stroke="${RULE}"/>`);
    out.push(`<text x="${x(d)}" y="${T + ph + 16}" text-anchor="middle" fill="${MUTED}">${isoUtc(d, 0).slice(5, 10)}</text>`);
  }
  r.tracks.forEach((t, i) => {
    const colour = hueFor(i);
    const pts = t.series.tMs.map((tm, k) => `${x(tm)},${y((100 * t.series.storedBits[k]!) / t.capacityBits)}`).join(' ');
    out.push(`<polyline fill="none" stroke="${colour}" stroke-width="1.6" stroke-linejoin="round" points="${pts}"/>`);
    const ly = T + 14 + i * 18;
    out.push(`<rect x="${L + pw + 14}" y="${ly - 5}" width="10" height="10" rx="2" fill="${colour}"/>`);
    out.push(`<text x="${L + pw + 30}" y="${ly}" dominant-baseline="middle" fill="${t.lostBits > 0 ? WARN : INK}">${xml(t.spacecraftId)}${t.lostBits > 0 ? ' (overflows)' : ''}</text>`);
  });
  out.push(`<text x="${L + pw / 2}" y="${H - 6}" text-anchor="middle" fill="${MUTED}">UTC date</text>`);
  out.push('</svg>');
  return out.join('\n') + '\n';
}

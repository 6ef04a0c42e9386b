/**
 * Renders a network booking: the summary (which solver ran, objective,
 * bound, gap, time limit), the booked tracks, the requirements met and
 * missed, and the tracking time lost to antenna mechanics; as terminal
 * tables, CSV files and the JSON section of plan.json. Pure. Fixed rounding.
 */
import { stringify } from 'csv-stringify/sync';
import type { BookingResult } from '../plan/booking/solve.js';
import type { RequirementOutcome } from '../plan/booking/types.js';
import type { RecorderResult } from '../plan/recorder.js';
import type { PlanResult } from '../plan/types.js';
import { isoInZone, isoUtc } from '../time/format.js';
import { fixed, formatBits, renderTable } from './table.js';

const time = (tMs: number, zone?: string) => (zone ? isoInZone(tMs, zone) : isoUtc(tMs, 0));

const UNIT: Record<string, string> = { tracksPerDay: 'tracks/day', minutesPerDay: 'min/day', volumePerDayGbit: 'Gbit/day', maxGapH: 'h max gap' };

/** One line per solver used: how many components, the worst gap and the status. */
export function solverSummary(b: BookingResult): string[] {
  const by = new Map<string, { n: number; gap: number; candidates: number; statuses: Set<string> }>();
  for (const c of b.components) {
    const e = by.get(c.solver) ?? { n: 0, gap: 0, candidates: 0, statuses: new Set<string>() };
    e.n++;
    e.gap = Math.max(e.gap, c.gap);
    e.candidates += c.candidates;
    e.statuses.add(c.status);
    by.set(c.solver, e);
  }
  return [...by.entries()].map(
    ([s, e]) => `  ${s}: ${e.n} component${e.n === 1 ? '' : 's'}, ${e.candidates} candidate tracks, worst gap ${(e.gap * 100).toFixed(3)} % (${[...e.statuses].sort().join(', ')})`,
  );
}

/** Requirement outcomes grouped per spacecraft and requirement: a gap requirement is one line. */
function requirementLines(rs: readonly RequirementOutcome[]): string[][] {
  const rows: string[][] = [];
  const groups = new Map<string, RequirementOutcome[]>();
  for (const r of rs) {
    const k = `${r.spacecraftId}\u0000${r.requirement.index}`;
    (groups.get(k) ?? groups.set(k, []).get(k)!).push(r);
  }
  for (const list of groups.values()) {
    const q = list[0]!.requirement;
    const what = `${q.value} ${UNIT[q.kind]}${q.kind === 'maxGapH' ? '' : ` (${q.dayZone})`}`;
    const kind = q.hard ? 'hard' : `soft (${q.penalty}/unit)`;
    if (q.kind === 'maxGapH') {
      const missed = list.filter((r) => !r.met);
      rows.push([
        list[0]!.spacecraftId,
        what,
        kind,
        `${list.length} windows`,
        `${list.length - missed.length}/${list.length} covered`,
        missed.length === 0 ? 'met' : 'MISSED',
        fixed(missed.reduce((s, r) => s + r.penaltyApplied, 0), 2),
        missed.length === 0 ? '' : `${missed.length} window(s) from ${missed[0]!.period}: ${missed[0]!.reason ?? ''}`,
      ]);
      continue;
    }
    for (const r of list) {
      rows.push([r.spacecraftId, what, kind, r.period, `${fixed(r.achieved, q.kind === 'tracksPerDay' ? 0 : 1)}/${r.needed}`, r.met ? 'met' : 'MISSED', fixed(r.penaltyApplied, 2), r.reason ?? '']);
    }
  }
  return rows;
}

export function renderBookingTable(plan: PlanResult, b: BookingResult, zone?: string, recorders?: RecorderResult): string {
  const parts: string[] = [];
  const sent = new Map<number, number>();
  for (const t of recorders?.tracks ?? []) for (const p of t.passes) sent.set(p.contactIndex, p.downlinkedBits);
  parts.push(
    `Antenna booking: ${b.tracks.length} tracks on a ${b.gridS} s grid${b.coarsestStepS > b.gridS ? ` (long windows: their edges, points beside the other windows and a coarser grid of up to ${b.coarsestStepS} s)` : ''}; ` +
      `objective ${b.objective.toFixed(3)} (value ${b.value.toFixed(3)} priority x Gbit, penalties ${b.softPenalty.toFixed(3)}), bound ${b.bound.toFixed(3)}, gap ${(b.gap * 100).toFixed(3)} %; ` +
      `MIP time limit ${b.timeLimitS} s, relative gap ${b.mipRelGap}`,
  );
  parts.push(`Solved in ${(b.timeMs / 1000).toFixed(2)} s.`);
  parts.push('Solvers:');
  parts.push(...solverSummary(b));
  parts.push('');
  parts.push(
    renderTable(
      [
        { header: 'station' },
        { header: 'ant', align: 'right' },
        { header: 'spacecraft' },
        { header: 'start' },
        { header: 'end' },
        { header: 'min', align: 'right' },
        { header: 'setup s', align: 'right' },
        { header: 'slew s', align: 'right' },
        { header: 'mech lost s', align: 'right' },
        { header: 'track volume', align: 'right' },
        { header: 'sent from recorder', align: 'right' },
      ],
      b.tracks.map((t, i) => {
        const c = t.candidate;
        const s = sent.get(i);
        return [
          c.stationId,
          String(t.antenna),
          c.spacecraftId,
          time(c.startMs, zone),
          time(c.endMs, zone),
          fixed((c.endMs - c.startMs) / 60000, 0),
          fixed(t.setupBeforeS, 0),
          fixed(t.slewBeforeS, 0),
          fixed(c.mechanicsLostS, 0),
          formatBits(c.bits),
          s === undefined ? '-' : formatBits(s),
        ];
      }),
    ),
  );
  if (b.requirements.length > 0) {
    parts.push('');
    parts.push('Service requirements');
    parts.push(
      renderTable(
        [{ header: 'spacecraft' }, { header: 'requirement' }, { header: 'kind' }, { header: 'period' }, { header: 'achieved', align: 'right' }, { header: 'result' }, { header: 'penalty', align: 'right' }, { header: 'reason' }],
        requirementLines(b.requirements),
      ),
    );
  }
  if (b.mechanics.length > 0) {
    parts.push('');
    parts.push('Tracking lost to antenna mechanics (rate, elevation, cable-wrap and X/Y limits; taken off the track volume)');
    parts.push(
      renderTable(
        [{ header: 'station' }, { header: 'spacecraft' }, { header: 'AOS' }, { header: 'max el', align: 'right' }, { header: 'lost s', align: 'right' }],
        b.mechanics.map((m) => {
          const c = plan.contacts[m.contactIndex]!;
          return [c.stationId, c.spacecraftId, time(c.aosMs, zone), fixed(c.maxElevationDeg, 1), fixed(m.lostS, 1)];
        }),
      ),
    );
  }
  const missed = b.requirements.filter((r) => !r.met && r.requirement.hard).length;
  if (missed > 0) parts.push('', `${missed} hard requirement period(s) missed (exit code 1)`);
  return parts.join('\n') + '\n';
}

export function renderBookingCsv(b: BookingResult, recorders?: RecorderResult): string {
  const sent = new Map<number, number>();
  for (const t of recorders?.tracks ?? []) for (const p of t.passes) sent.set(p.contactIndex, p.downlinkedBits);
  return stringify(
    b.tracks.map((t, i) => {
      const c = t.candidate;
      return [c.stationId, t.antenna, c.spacecraftId, isoUtc(c.startMs, 0), isoUtc(c.endMs, 0), t.setupBeforeS.toFixed(1), t.slewBeforeS.toFixed(1), c.mechanicsLostS.toFixed(1), c.bits, sent.get(i) ?? ''];
    }),
    { header: true, columns: ['station', 'antenna', 'spacecraft', 'start_utc', 'end_utc', 'setup_before_s', 'slew_before_s', 'mechanics_lost_s', 'track_bits', 'sent_from_recorder_bits'] },
  );
}

export function renderRequirementsCsv(b: BookingResult): string {
  return stringify(
    b.requirements.map((r) => [r.spacecraftId, r.requirement.kind, r.requirement.value, r.requirement.hard ? 'hard' : 'soft', r.period, r.needed, Number(r.achieved.toFixed(6)), r.met ? 'met' : 'missed', Number(r.penaltyApplied.toFixed(6)), r.reason ?? '']),
    { header: true, columns: ['spacecraft', 'requirement', 'value', 'kind', 'period', 'needed', 'achieved', 'result', 'penalty', 'reason'] },
  );
}

export function bookingJson(b: BookingResult, recorders?: RecorderResult): Record<string, unknown> {
  const sent = new Map<number, number>();
  for (const t of recorders?.tracks ?? []) for (const p of t.passes) sent.set(p.contactIndex, p.downlinkedBits);
  return {
    grid_s: b.gridS,
    coarsest_step_s: b.coarsestStepS,
    objective: Number(b.objective.toFixed(6)),
    value: Number(b.value.toFixed(6)),
    soft_penalty: Number(b.softPenalty.toFixed(6)),
    bound: Number(b.bound.toFixed(6)),
    gap: Number(b.gap.toFixed(6)),
    time_limit_s: b.timeLimitS,
    mip_rel_gap: b.mipRelGap,
    components: b.components.map((c) => ({ solver: c.solver, status: c.status, stations: c.stations, spacecraft: c.spacecraft, candidates: c.candidates, variables: c.variables, objective: Number(c.objective.toFixed(6)), bound: Number(c.bound.toFixed(6)), gap: Number(c.gap.toFixed(6)) })),
    tracks: b.tracks.map((t, i) => ({
      station: t.candidate.stationId,
      antenna: t.antenna,
      spacecraft: t.candidate.spacecraftId,
      start_utc: isoUtc(t.candidate.startMs, 0),
      end_utc: isoUtc(t.candidate.endMs, 0),
      setup_before_s: Number(t.setupBeforeS.toFixed(1)),
      slew_before_s: Number(t.slewBeforeS.toFixed(1)),
      mechanics_lost_s: Number(t.candidate.mechanicsLostS.toFixed(1)),
      track_bits: t.candidate.bits,
      sent_from_recorder_bits: sent.get(i) ?? null,
    })),
    requirements: b.requirements.map((r) => ({
      spacecraft: r.spacecraftId,
      requirement: r.requirement.kind,
      value: r.requirement.value,
      hard: r.requirement.hard,
      period: r.period,
      needed: r.needed,
      achieved: Number(r.achieved.toFixed(6)),
      met: r.met,
      penalty: Number(r.penaltyApplied.toFixed(6)),
      reason: r.reason,
    })),
    missed_hard: b.missedHard,
  };
}

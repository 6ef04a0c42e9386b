/**
 * Renders an antenna schedule: terminal sections (per station, lost windows
 * with their reasons, volume lost per spacecraft), the schedule CSV (every
 * window, taken or lost) and the JSON block added to plan.json. Pure: returns
 * strings and plain objects; writing is write.ts's job. Fixed rounding.
 */
import { stringify } from 'csv-stringify/sync';
import type { PlanResult } from '../plan/types.js';
import type { ContactRef, LostReason, ScheduleResult } from '../plan/schedule.js';
import type { RecorderResult } from '../plan/recorder.js';
import { isoUtc, isoInZone } from '../time/format.js';
import { formatBits, renderTable } from './table.js';

const time = (tMs: number, zone?: string) => (zone ? isoInZone(tMs, zone) : isoUtc(tMs, 0));

function refText(r: ContactRef, zone?: string): string {
  return `${r.spacecraftId}@${r.stationId} ${time(r.aosMs, zone)}..${time(r.losMs, zone)}`;
}

/** The first `max` windows named, then how many more. */
function refsText(refs: readonly ContactRef[], zone: string | undefined, max: number): string {
  const shown = refs.slice(0, max).map((r) => refText(r, zone));
  return shown.join('; ') + (refs.length > max ? `; and ${refs.length - max} more` : '');
}

/** One line saying why a window was lost (naming at most `max` conflicting windows). */
export function reasonText(reason: LostReason, zone?: string, max = 2): string {
  switch (reason.kind) {
    case 'overlap':
      return `antennas busy: overlaps ${refsText(reason.with, zone, max)}`;
    case 'setup':
      return `setup time ${reason.setupTimeS} s: too close to ${refsText(reason.with, zone, max)}`;
    case 'one-station':
      return `one station at a time: ${refText(reason.with, zone)} kept`;
    case 'no-data':
      return 'no data (no link volume or priority 0)';
  }
}

const reasonWith = (reason: LostReason): ContactRef[] =>
  reason.kind === 'overlap' || reason.kind === 'setup' ? reason.with : reason.kind === 'one-station' ? [reason.with] : [];

/** Bits that left each spacecraft's recorder, when recorders were simulated. */
function deliveredBySpacecraft(recorders: RecorderResult | undefined): Map<string, number> {
  return new Map((recorders?.tracks ?? []).map((t) => [t.spacecraftId, t.downlinkedBits]));
}

/**
 * "offered" and "capacity taken" are link capacity summed over the windows (station sum);
 * with recorders, "delivered" is what actually left the recorder.
 */
export function renderScheduleTable(plan: PlanResult, s: ScheduleResult, zone?: string, recorders?: RecorderResult): string {
  const delivered = deliveredBySpacecraft(recorders);
  const parts: string[] = [];
  parts.push(`Antenna schedule (${s.weightRule}${s.oneStationAtATime ? `; one station at a time, ${s.rounds} round${s.rounds === 1 ? '' : 's'}` : ''})`);
  parts.push('');
  parts.push(
    renderTable(
      [
        { header: 'station' },
        { header: 'antennas', align: 'right' },
        { header: 'setup s', align: 'right' },
        { header: 'method' },
        { header: 'windows', align: 'right' },
        { header: 'taken', align: 'right' },
        { header: 'lost', align: 'right' },
      ],
      s.stations.map((st) => [st.stationId, String(st.antennaCount), String(st.setupTimeS), st.method, String(st.offered), String(st.taken), String(st.offered - st.taken)]),
    ),
  );
  parts.push('');
  parts.push('Volume per spacecraft (link capacity summed over the windows; delivered: what left the onboard recorder)');
  parts.push(
    renderTable(
      [
        { header: 'spacecraft' },
        { header: 'priority', align: 'right' },
        { header: 'capacity offered', align: 'right' },
        { header: 'capacity taken', align: 'right' },
        { header: 'delivered (recorder)', align: 'right' },
        { header: 'lost to conflicts', align: 'right' },
        { header: 'windows taken', align: 'right' },
        { header: 'windows lost', align: 'right' },
      ],
      s.spacecraft.map((r) => [
        r.spacecraftId,
        String(r.priority),
        formatBits(r.offeredBits),
        formatBits(r.deliveredBits),
        delivered.has(r.spacecraftId) ? formatBits(delivered.get(r.spacecraftId)!) : '-',
        r.offeredBits > 0 ? `${formatBits(r.lostBits)} (${((100 * r.lostBits) / r.offeredBits).toFixed(1)} %)` : formatBits(r.lostBits),
        String(r.takenWindows),
        String(r.lostWindows),
      ]),
    ),
  );
  const lost = s.lost.filter((l) => l.reason.kind !== 'no-data');
  parts.push('');
  if (lost.length === 0) parts.push('No window lost to a conflict.');
  else {
    parts.push(`Windows lost to conflicts (${lost.length})`);
    parts.push(
      renderTable(
        [{ header: 'station' }, { header: 'spacecraft' }, { header: zone ? `AOS (${zone})` : 'AOS (UTC)' }, { header: 'LOS' }, { header: 'volume', align: 'right' }, { header: 'why' }],
        lost.map((l) => {
          const c = plan.contacts[l.contactIndex]!;
          return [c.stationId, c.spacecraftId, time(c.aosMs, zone), time(c.losMs, zone), formatBits(l.volumeBits), reasonText(l.reason, zone)];
        }),
      ),
    );
  }
  const noData = s.lost.length - lost.length;
  if (noData > 0) parts.push(`${noData} window${noData === 1 ? '' : 's'} without data not scheduled.`);
  return parts.join('\n') + '\n';
}

/** Every window with its fate: one row per contact of the plan, in plan order. */
export function renderScheduleCsv(plan: PlanResult, s: ScheduleResult): string {
  const taken = new Map(s.taken.map((t) => [t.contactIndex, t]));
  const lost = new Map(s.lost.map((l) => [l.contactIndex, l]));
  const rows = plan.contacts.map((c, i) => {
    const t = taken.get(i);
    const l = lost.get(i);
    return {
      station: c.stationId,
      spacecraft: c.spacecraftId,
      aos_utc: isoUtc(c.aosMs, 3),
      los_utc: isoUtc(c.losMs, 3),
      status: t ? 'taken' : 'lost',
      antenna: t ? t.antenna : '',
      volume_bits: c.link?.volumeBits ?? 0,
      weight: t ? t.weight : '',
      reason: l ? l.reason.kind : '',
      conflicts_with: l ? reasonWith(l.reason).map((r) => `${r.spacecraftId}@${r.stationId} ${isoUtc(r.aosMs, 3)}`).join('; ') : '',
    };
  });
  return stringify(rows, {
    header: true,
    columns: ['station', 'spacecraft', 'aos_utc', 'los_utc', 'status', 'antenna', 'volume_bits', 'weight', 'reason', 'conflicts_with'],
  });
}

/** The schedule block of plan.json. */
export function scheduleJson(plan: PlanResult, s: ScheduleResult, recorders?: RecorderResult): Record<string, unknown> {
  const delivered = deliveredBySpacecraft(recorders);
  const ref = (r: ContactRef) => ({ station: r.stationId, spacecraft: r.spacecraftId, aos_utc: isoUtc(r.aosMs, 3), los_utc: isoUtc(r.losMs, 3) });
  return {
    weight_rule: s.weightRule,
    one_station_at_a_time: s.oneStationAtATime,
    rounds: s.rounds,
    stations: s.stations.map((st) => ({
      station: st.stationId,
      antennas: st.antennaCount,
      setup_time_s: st.setupTimeS,
      method: st.method,
      windows: st.offered,
      taken: st.taken,
    })),
    spacecraft: s.spacecraft.map((r) => ({
      spacecraft: r.spacecraftId,
      priority: r.priority,
      capacity_offered_bits: r.offeredBits,
      capacity_taken_bits: r.deliveredBits,
      ...(delivered.has(r.spacecraftId) ? { delivered_from_recorder_bits: delivered.get(r.spacecraftId)! } : {}),
      lost_to_conflicts_bits: r.lostBits,
      windows_taken: r.takenWindows,
      windows_lost: r.lostWindows,
    })),
    taken: s.taken.map((t) => {
      const c = plan.contacts[t.contactIndex]!;
      return { station: c.stationId, spacecraft: c.spacecraftId, aos_utc: isoUtc(c.aosMs, 3), los_utc: isoUtc(c.losMs, 3), antenna: t.antenna, volume_bits: t.volumeBits };
    }),
    lost: s.lost.map((l) => {
      const c = plan.contacts[l.contactIndex]!;
      return {
        station: c.stationId,
        spacecraft: c.spacecraftId,
        aos_utc: isoUtc(c.aosMs, 3),
        los_utc: isoUtc(c.losMs, 3),
        volume_bits: l.volumeBits,
        reason: l.reason.kind,
        ...(l.reason.kind === 'setup' ? { setup_time_s: l.reason.setupTimeS } : {}),
        with: reasonWith(l.reason).map(ref),
      };
    }),
  };
}

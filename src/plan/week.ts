/**
 * The plan stage as a whole: from the contacts with their volumes (runPlan / the worker
 * pool / merged shards) to everything `plan` shows and writes: the schedule and the
 * recorders (when asked), daily totals, per-spacecraft totals, and for the report the
 * margin rows and the charted contacts. Pure: the CLI only renders and writes the result.
 */
import type { Scenario, Span } from '../scenario/types.js';
import type { PassView } from '../report/html/pass-views.js';
import type { Provenance } from '../report/html/provenance.js';
import { SERIES_SPACECRAFT_LIMIT } from '../report/html/bounds.js';
import { packageVersion } from '../scenario/paths.js';
import { passWarnings } from './pass-warnings.js';
import { allStationsDaily, dailyTotals, spacecraftTotals, type AllStationsDay, type DailyRow, type DayMode, type SpacecraftTotal } from './daily.js';
import { marginRows, type MarginRow } from './margin.js';
import { simulateRecorders, type RecorderResult } from './recorder.js';
import { scheduleContacts, scheduledPlan, type ScheduleResult } from './schedule.js';
import { highestVolumeContacts, passesThatMatter, seriesForContacts, type ContactSeries } from './series.js';
import type { PlanResult } from './types.js';
import { uniqueVolumes } from './unique-volume.js';
import { workerMarginRows, workerUniqueVolumes } from './worker-parts.js';

export interface WeekOptions {
  dayMode: DayMode;
  /** Deconflict antennas and simulate the recorders. */
  schedule: boolean;
  /** With the schedule: a spacecraft downlinks to one station at a time. */
  oneStationAtATime: boolean;
}

/** Track periods booked by `plan --booking` (cli/booking.ts): what is shown instead of a schedule. */
export interface BookedWeek {
  plan: PlanResult;
  recorders: RecorderResult;
}

export interface Week {
  /** Every window found (the schedule's input). */
  unscheduled: PlanResult;
  /** What is shown: the windows taken when scheduled, else every window. */
  plan: PlanResult;
  dayMode: DayMode;
  daily: DailyRow[];
  totals: SpacecraftTotal[];
  /** Station-days summed over stations (UTC days only). */
  allStations: AllStationsDay[] | undefined;
  schedule: ScheduleResult | undefined;
  recorders: RecorderResult | undefined;
  /** The booking when one was made (then no schedule). */
  booked: BookedWeek | undefined;
  oneStationAtATime: boolean;
}

export function planWeek(scenario: Scenario, unscheduled: PlanResult, opts: WeekOptions, booked?: BookedWeek): Week {
  const scheduled = !booked && (opts.schedule || opts.oneStationAtATime);
  const schedule = scheduled ? scheduleContacts(unscheduled, scenario.stations, scenario.spacecraft, { oneStationAtATime: opts.oneStationAtATime }) : undefined;
  const recorders = booked ? booked.recorders : schedule ? simulateRecorders(unscheduled, scenario.spacecraft, schedule) : undefined;
  const plan = booked ? booked.plan : schedule ? scheduledPlan(unscheduled, schedule) : unscheduled;
  const daily = dailyTotals(plan, opts.dayMode);
  // with a recorder, delivered = what left the recorder; the link volume is capacity
  const delivered = recorders ? new Map(recorders.tracks.map((t) => [t.spacecraftId, t.downlinkedBits])) : undefined;
  const ids = plan.spacecraft.map((s) => s.id);
  const unique = workerUniqueVolumes(plan, ids) ?? uniqueVolumes(ids, plan.contacts);
  const totals = spacecraftTotals(plan, delivered, unique);
  const allStations = opts.dayMode.kind === 'utc' ? allStationsDaily(plan, daily, unique) : undefined;
  return { unscheduled, plan, dayMode: opts.dayMode, daily, totals, allStations, schedule, recorders, booked, oneStationAtATime: opts.oneStationAtATime };
}

/** What the HTML report adds to the week: margin rows of every pair, the charted contacts, the passes that matter, provenance. */
export interface WeekReportParts {
  margins: MarginRow[];
  series: ContactSeries[];
  passViews: PassView[];
  provenance: Provenance;
}

export function weekReportParts(scenario: Scenario, span: Span, week: Week): WeekReportParts {
  const { plan, dayMode, schedule } = week;
  return {
    margins: workerMarginRows(week.unscheduled) ?? marginRows(scenario, week.unscheduled),
    series: seriesForContacts(scenario, span, highestVolumeContacts(plan).slice(0, SERIES_SPACECRAFT_LIMIT)),
    passViews: passViewsFor(scenario, span, plan),
    provenance: provenanceFor(scenario, span, plan, [
      ['link step', `${plan.linkStepS} s`],
      ['availability', `${plan.availabilityPercent} %`],
      ['days', dayMode.kind === 'utc' ? 'UTC' : "each station's local days"],
      ['antenna schedule', schedule ? (week.oneStationAtATime ? 'on, one station at a time' : 'on') : 'off'],
    ]),
  };
}

/** The passes that matter, sampled with their warnings, for the report. */
function passViewsFor(scenario: Scenario, span: Span, plan: PlanResult): PassView[] {
  const chosen = passesThatMatter(plan);
  const series = seriesForContacts(scenario, span, chosen.map((c) => c.contact));
  return chosen.flatMap(({ contact, why }) => {
    const s = series.find((x) => x.stationId === contact.stationId && x.spacecraftId === contact.spacecraftId && x.aosMs === contact.aosMs);
    const st = scenario.stations.find((x) => x.id === contact.stationId);
    return s && st ? [{ contact, why, series: s, mask: st.mask, warnings: passWarnings(s, st) }] : [];
  });
}

/** Input files, element sets (the one nearest the span start per spacecraft), version and options. */
function provenanceFor(scenario: Scenario, span: Span, plan: PlanResult, options: [string, string][]): Provenance {
  const elementSets = scenario.spacecraft.flatMap((sc) => {
    if (sc.orbit.kind !== 'elements' || sc.orbit.sets.length === 0) return [];
    const nearest = sc.orbit.sets.reduce((b, x) => (Math.abs(x.epochMs - span.startMs) < Math.abs(b.epochMs - span.startMs) ? x : b));
    return [{ spacecraftId: sc.id, catalogNumber: nearest.catalogNumber, epochMs: nearest.epochMs }];
  });
  return { toolVersion: packageVersion(), inputs: scenario.inputFiles, elementSets, options, spanStartMs: plan.span.startMs, spanEndMs: plan.span.endMs };
}

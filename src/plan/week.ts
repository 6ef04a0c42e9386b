/**
 * The plan stage as a whole: from the contacts with their volumes (runPlan / the worker
 * pool / merged shards) to everything `plan` shows and writes: the schedule and the
 * recorders (when asked), daily totals, per-spacecraft totals, and for the report the
 * margin rows and the charted contacts. Pure: the CLI only renders and writes the result.
 */
import type { Scenario, Span } from '../scenario/types.js';
import { allStationsDaily, dailyTotals, spacecraftTotals, type AllStationsDay, type DailyRow, type DayMode, type SpacecraftTotal } from './daily.js';
import { marginRows, type MarginRow } from './margin.js';
import { simulateRecorders, type RecorderResult } from './recorder.js';
import { scheduleContacts, scheduledPlan, type ScheduleResult } from './schedule.js';
import { highestVolumeContacts, seriesForContacts, type ContactSeries } from './series.js';
import type { PlanResult } from './types.js';
import { uniqueVolumes } from './unique-volume.js';

export interface WeekOptions {
  dayMode: DayMode;
  /** Deconflict antennas and simulate the recorders. */
  schedule: boolean;
  /** With the schedule: a spacecraft downlinks to one station at a time. */
  oneStationAtATime: boolean;
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
}

export function planWeek(scenario: Scenario, unscheduled: PlanResult, opts: WeekOptions): Week {
  const scheduled = opts.schedule || opts.oneStationAtATime;
  const schedule = scheduled ? scheduleContacts(unscheduled, scenario.stations, scenario.spacecraft, { oneStationAtATime: opts.oneStationAtATime }) : undefined;
  const recorders = schedule ? simulateRecorders(unscheduled, scenario.spacecraft, schedule) : undefined;
  const plan = schedule ? scheduledPlan(unscheduled, schedule) : unscheduled;
  const daily = dailyTotals(plan, opts.dayMode);
  // with a recorder, delivered = what left the recorder; the link volume is capacity
  const delivered = recorders ? new Map(recorders.tracks.map((t) => [t.spacecraftId, t.downlinkedBits])) : undefined;
  const unique = uniqueVolumes(
    plan.spacecraft.map((s) => s.id),
    plan.contacts,
  );
  const totals = spacecraftTotals(plan, delivered, unique);
  const allStations = opts.dayMode.kind === 'utc' ? allStationsDaily(plan, daily, unique) : undefined;
  return { unscheduled, plan, dayMode: opts.dayMode, daily, totals, allStations, schedule, recorders };
}

/** What the HTML report adds to the week: margin rows of every pair and the charted contacts. */
export interface WeekReportParts {
  margins: MarginRow[];
  series: ContactSeries[];
}

export function weekReportParts(scenario: Scenario, span: Span, week: Week): WeekReportParts {
  return {
    margins: marginRows(scenario, week.unscheduled),
    series: seriesForContacts(scenario, span, highestVolumeContacts(week.plan)),
  };
}

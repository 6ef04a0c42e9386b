/** `passbudget plan`: contact windows, volume per contact, report files under --out. */
import type { Command } from 'commander';
import { assertPreflight, withNamedProblems } from '../plan/preflight.js';
import { runPlanParallel } from '../plan/parallel.js';
import { renderPlanTable, renderPlanJson, renderPlanCsv, renderSunOutagesCsv } from '../report/plan.js';
import { writeOutputs } from '../report/write.js';
import { allStationsDaily, dailyTotals, spacecraftTotals, type DayMode } from '../plan/daily.js';
import { highestVolumeContacts, passesThatMatter, seriesForContacts } from '../plan/series.js';
import { passWarnings } from '../plan/pass-warnings.js';
import { packageVersion } from '../scenario/paths.js';
import type { PlanResult } from '../plan/types.js';
import type { Scenario, Span } from '../scenario/types.js';
import type { PassView } from '../report/html/pass-views.js';
import type { Provenance } from '../report/html/provenance.js';
import { allStationsDayRecord, dailyRecord, renderDailyCsv, renderDailyTable, spacecraftTotalRecord } from '../report/daily.js';
import { renderCalendars } from '../report/calendar.js';
import { renderReportHtml } from '../report/html/index.js';
import { SERIES_SPACECRAFT_LIMIT } from '../report/html/bounds.js';
import { scheduleContacts, scheduledPlan } from '../plan/schedule.js';
import { simulateRecorders } from '../plan/recorder.js';
import { renderScheduleCsv, renderScheduleTable, scheduleJson } from '../report/schedule.js';
import { recorderJson, renderRecorderCsv, renderRecorderSvg, renderRecorderTable } from '../report/recorder.js';
import { marginRows } from '../plan/margin.js';
import { countHook, progressLine } from './progress.js';
import { addCommonOptions, prepareOutput, readCommonOptions, spanFor, withAvailability, loadScenarioNoting, withExamples } from './options.js';
import { DEFAULT_LINK_STEP_S } from '../plan/link.js';
import type { CliIo } from './io.js';
import type { SetExit } from './commands.js';
import { BOOKING_OUTPUTS, readBooking, runBooking } from './booking.js';

/** Fixed names plan writes (checked before the work: none may be a folder). */
const PLAN_OUTPUTS = ['plan.json', 'contacts.csv', 'daily.csv', 'sun-outages.csv', 'contacts.ics', 'report.html', 'schedule.csv', 'recorder.csv', 'recorder.svg', ...BOOKING_OUTPUTS];

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

export function registerPlan(program: Command, io: CliIo, setExit: SetExit): void {
  withExamples(
    addCommonOptions(program.command('plan').description('contact windows of every spacecraft over every station, with the data volume of each contact'), {
      formats: ['table', 'json', 'csv'],
      step: `link sampling step inside contacts, e.g. 10s, 1m (default: ${DEFAULT_LINK_STEP_S}s)`,
    }),
    [
      ['passbudget plan', 'the bundled demo week: tables here, plan.json, contacts.csv, daily.csv, calendars and report.html under out/'],
      ['passbudget plan --spacecraft fleet.yaml --network net.yaml --days 1 --no-write', 'one day of your own files, printed only'],
      ['passbudget plan --schedule --step 10s --out week', 'antennas deconflicted and recorders simulated, 10 s link steps, files under week/'],
    ],
  )
    .option('--local-days', "daily totals over each station's local days (its IANA zone) instead of UTC days")
    .option('--schedule', 'deconflict antennas (priority x volume), show only the windows taken, simulate the onboard recorders')
    .option('--one-station-at-a-time', 'with --schedule: a spacecraft downlinks to one station at a time')
    .option('--booking <file>', 'book track periods by the rules of this file (requirements, station rules, antenna mechanics) instead of whole windows')
    .action(async (raw: Parameters<typeof readCommonOptions>[0] & { localDays?: boolean; schedule?: boolean; oneStationAtATime?: boolean; booking?: string }) => {
      const opts = readCommonOptions(raw);
      prepareOutput(opts, io, PLAN_OUTPUTS);
      const dayMode: DayMode = raw.localDays ? { kind: 'local' } : { kind: 'utc' };
      const scenario = withAvailability(loadScenarioNoting(opts.files, io), opts.availabilityPercent);
      const rules = await readBooking(raw.booking, scenario);
      const span = spanFor(opts, scenario, io);
      assertPreflight(scenario, span); // file and field of a model-range problem, before any work
      const progress = progressLine(io, 'plan');
      const unscheduled = await withNamedProblems(scenario, span, () =>
        runPlanParallel(scenario, span, {
          ...(opts.stepS !== undefined ? { linkStepS: opts.stepS } : {}),
          onProgress: countHook(progress, 'stage'),
        }),
      );
      progress.end();
      const oneStation = Boolean(raw.oneStationAtATime);
      const booked = rules ? await runBooking(unscheduled, scenario, rules) : undefined;
      const schedule = !booked && (raw.schedule || oneStation) ? scheduleContacts(unscheduled, scenario.stations, scenario.spacecraft, { oneStationAtATime: oneStation }) : undefined;
      const recorders = booked ? booked.recorders : schedule ? simulateRecorders(unscheduled, scenario.spacecraft, schedule) : undefined;
      const plan = booked ? booked.plan : schedule ? scheduledPlan(unscheduled, schedule) : unscheduled;
      const daily = dailyTotals(plan, dayMode);
      // with a recorder, delivered = what left the recorder; the link volume is capacity
      const delivered = recorders ? new Map(recorders.tracks.map((t) => [t.spacecraftId, t.downlinkedBits])) : undefined;
      const totals = spacecraftTotals(plan, delivered);
      const allStations = dayMode.kind === 'utc' ? allStationsDaily(plan, daily) : undefined;
      const json = renderPlanJson(plan, {
        daily: daily.map(dailyRecord),
        ...(allStations ? { daily_all_stations: allStations.map(allStationsDayRecord) } : {}),
        spacecraft_totals: totals.map(spacecraftTotalRecord),
        ...(schedule && recorders ? { schedule: scheduleJson(unscheduled, schedule, recorders), recorder: recorderJson(recorders) } : {}),
        ...(booked ? { booking: booked.json, recorder: recorderJson(booked.recorders) } : {}),
      });
      const csv = renderPlanCsv(plan);
      if (opts.format === 'json') io.out(json);
      else if (opts.format === 'csv') io.out(csv);
      else io.out(renderPlanTable(plan, opts.zone) + '\n' + renderDailyTable(daily, dayMode, totals, allStations));
      if (opts.format === 'table' && schedule && recorders) io.out('\n' + renderScheduleTable(unscheduled, schedule, opts.zone, recorders) + '\n' + renderRecorderTable(recorders));
      if (opts.format === 'table' && booked) io.out('\n' + booked.table(opts.zone) + '\n' + renderRecorderTable(booked.recorders));
      for (const w of plan.warnings) io.err(`warning: ${w}\n`);
      if (opts.write) {
        const written = await writeOutputs(opts.outDir, [
          { name: 'plan.json', content: json },
          { name: 'contacts.csv', content: csv },
          { name: 'daily.csv', content: renderDailyCsv(daily) },
          { name: 'sun-outages.csv', content: renderSunOutagesCsv(plan) },
          ...(schedule && recorders
            ? [
                { name: 'schedule.csv', content: renderScheduleCsv(unscheduled, schedule) },
                { name: 'recorder.csv', content: renderRecorderCsv(recorders) },
                { name: 'recorder.svg', content: renderRecorderSvg(recorders) },
              ]
            : []),
          ...(booked
            ? [...booked.files, { name: 'recorder.csv', content: renderRecorderCsv(booked.recorders) }, { name: 'recorder.svg', content: renderRecorderSvg(booked.recorders) }]
            : []),
          ...renderCalendars(plan),
          {
            name: 'report.html',
            content: renderReportHtml({
              plan,
              dayMode,
              daily,
              spacecraftTotals: totals,
              series: seriesForContacts(scenario, span, highestVolumeContacts(plan).slice(0, SERIES_SPACECRAFT_LIMIT)),
              margins: marginRows(scenario, unscheduled).map((m) => ({
                station: m.station,
                spacecraft: m.spacecraft,
                maskMarginDb: m.maskMarginDb,
                worstSeenMarginDb: m.worstSeenMarginDb ?? Number.NaN,
                pass: m.pass,
                notVisible: m.result === 'not visible',
              })),
              ...(recorders ? { recorderSvg: renderRecorderSvg(recorders) } : {}),
              passViews: passViewsFor(scenario, span, plan),
              losses: [
                ...(schedule ? schedule.spacecraft.map((l) => ({ spacecraftId: l.spacecraftId, offeredBits: l.offeredBits, lostBits: l.lostBits, cause: 'the antenna schedule' })) : []),
                ...(recorders ? recorders.tracks.map((t) => ({ spacecraftId: t.spacecraftId, offeredBits: t.generatedBits, lostBits: t.lostBits, cause: 'a full recorder' })) : []),
              ],
              provenance: provenanceFor(scenario, span, plan, [
                ['link step', `${plan.linkStepS} s`],
                ['availability', `${plan.availabilityPercent} %`],
                ['days', dayMode.kind === 'utc' ? 'UTC' : "each station's local days"],
                ['antenna schedule', schedule ? (oneStation ? 'on, one station at a time' : 'on') : 'off'],
              ]),
            }),
          },
        ]);
        if (opts.format === 'table') io.out(`\nwrote ${written.join(', ')}\n`);
      }
      setExit(booked ? booked.exitCode : 0);
    });
}

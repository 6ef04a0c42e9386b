/** `passbudget plan`: contact windows, volume per contact, report files under --out. */
import type { Command } from 'commander';
import { loadScenario } from '../scenario/load.js';
import { assertPreflight, withNamedProblems } from '../plan/preflight.js';
import { runPlanParallel } from '../plan/parallel.js';
import { renderPlanTable, planJsonPieces, planCsvPieces, contactsJsonLinesPieces } from '../report/plan.js';
import { writeOutputs } from '../report/write.js';
import { allStationsDaily, dailyTotals, spacecraftTotals, type DayMode } from '../plan/daily.js';
import { highestVolumeContacts, seriesForContacts } from '../plan/series.js';
import { allStationsDayRecord, dailyRecord, renderDailyCsv, renderDailyTable, spacecraftTotalRecord } from '../report/daily.js';
import { calendarFiles } from '../report/calendar.js';
import { renderReportHtml } from '../report/html/index.js';
import { scheduleContacts, scheduledPlan } from '../plan/schedule.js';
import { simulateRecorders } from '../plan/recorder.js';
import { renderScheduleCsv, renderScheduleTable, scheduleJson } from '../report/schedule.js';
import { recorderJson, renderRecorderCsv, renderRecorderSvg, renderRecorderTable } from '../report/recorder.js';
import { marginRows } from '../plan/margin.js';
import { countHook, progressLine } from './progress.js';
import { addCommonOptions, prepareOutput, readCommonOptions, spanFor } from './options.js';
import { outPieces, type CliIo } from './io.js';
import type { SetExit } from './commands.js';

/** Fixed names plan writes (checked before the work: none may be a folder). */
const PLAN_OUTPUTS = ['plan.json', 'contacts.csv', 'contacts.jsonl', 'daily.csv', 'contacts.ics', 'report.html', 'schedule.csv', 'recorder.csv', 'recorder.svg'];

export function registerPlan(program: Command, io: CliIo, setExit: SetExit): void {
  addCommonOptions(
    program.command('plan').description('contact windows of every spacecraft over every station, with the data volume of each contact'),
  )
    .option('--local-days', "daily totals over each station's local days (its IANA zone) instead of UTC days")
    .option('--schedule', 'deconflict antennas (priority x volume), show only the windows taken, simulate the onboard recorders')
    .option('--one-station-at-a-time', 'with --schedule: a spacecraft downlinks to one station at a time')
    .option('--stats', 'print the work done on stderr: contacts, link samples, SGP4 propagations')
    .action(async (raw: Parameters<typeof readCommonOptions>[0] & { localDays?: boolean; schedule?: boolean; oneStationAtATime?: boolean; stats?: boolean }) => {
      const opts = readCommonOptions(raw);
      prepareOutput(opts, io, PLAN_OUTPUTS);
      const dayMode: DayMode = raw.localDays ? { kind: 'local' } : { kind: 'utc' };
      const scenario = loadScenario(opts.files);
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
      const schedule = raw.schedule || oneStation ? scheduleContacts(unscheduled, scenario.stations, scenario.spacecraft, { oneStationAtATime: oneStation }) : undefined;
      const recorders = schedule ? simulateRecorders(unscheduled, scenario.spacecraft, schedule) : undefined;
      const plan = schedule ? scheduledPlan(unscheduled, schedule) : unscheduled;
      const daily = dailyTotals(plan, dayMode);
      // with a recorder, delivered = what left the recorder; the link volume is capacity
      const delivered = recorders ? new Map(recorders.tracks.map((t) => [t.spacecraftId, t.downlinkedBits])) : undefined;
      const totals = spacecraftTotals(plan, delivered);
      const allStations = dayMode.kind === 'utc' ? allStationsDaily(plan, daily) : undefined;
      const jsonExtra = {
        daily: daily.map(dailyRecord),
        ...(allStations ? { daily_all_stations: allStations.map(allStationsDayRecord) } : {}),
        spacecraft_totals: totals.map(spacecraftTotalRecord),
        ...(schedule && recorders ? { schedule: scheduleJson(unscheduled, schedule, recorders), recorder: recorderJson(recorders) } : {}),
      };
      if (opts.format === 'json') outPieces(io, planJsonPieces(plan, jsonExtra));
      else if (opts.format === 'csv') outPieces(io, planCsvPieces(plan));
      else io.out(renderPlanTable(plan, opts.zone) + '\n' + renderDailyTable(daily, dayMode, totals, allStations));
      if (opts.format === 'table' && schedule && recorders) io.out('\n' + renderScheduleTable(unscheduled, schedule, opts.zone, recorders) + '\n' + renderRecorderTable(recorders));
      for (const w of plan.warnings) io.err(`warning: ${w}\n`);
      if (raw.stats) io.err(`stats: ${plan.contacts.length} contacts, ${plan.stats.linkSamples} link samples, ${plan.stats.propagations} SGP4 propagations\n`);
      if (opts.write) {
        const written = await writeOutputs(opts.outDir, [
          { name: 'plan.json', content: planJsonPieces(plan, jsonExtra) },
          { name: 'contacts.csv', content: planCsvPieces(plan) },
          { name: 'contacts.jsonl', content: contactsJsonLinesPieces(plan) },
          { name: 'daily.csv', content: renderDailyCsv(daily) },
          ...(schedule && recorders
            ? [
                { name: 'schedule.csv', content: renderScheduleCsv(unscheduled, schedule) },
                { name: 'recorder.csv', content: renderRecorderCsv(recorders) },
                { name: 'recorder.svg', content: renderRecorderSvg(recorders) },
              ]
            : []),
          ...calendarFiles(plan),
          {
            name: 'report.html',
            content: renderReportHtml({
              plan,
              dayMode,
              daily,
              spacecraftTotals: totals,
              series: seriesForContacts(scenario, span, highestVolumeContacts(plan)),
              margins: marginRows(scenario, unscheduled).map((m) => ({
                station: m.station,
                spacecraft: m.spacecraft,
                maskMarginDb: m.maskMarginDb,
                worstSeenMarginDb: m.worstSeenMarginDb ?? Number.NaN,
                pass: m.pass,
                notVisible: m.result === 'not visible',
              })),
              ...(recorders ? { recorderSvg: renderRecorderSvg(recorders) } : {}),
            }),
          },
        ]);
        if (opts.format === 'table') io.out(`\nwrote ${written.join(', ')}\n`);
      }
      setExit(0);
    });
}

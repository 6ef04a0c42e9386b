/**
 * What `plan` (and `merge`, which ends in the same outputs) shows and writes for a week:
 * the terminal output, the warnings, and the files under --out, each made in pieces while
 * it is written (report/write.ts: all or nothing).
 */
import { planTablePieces, planJsonPieces, planCsvPieces, contactsJsonLinesPieces, renderSunOutagesCsv } from '../report/plan.js';
import { writeOutputs, type OutputFile } from '../report/write.js';
import { allStationsDayRecord, dailyRecord, renderDailyCsv, renderDailyTable, spacecraftTotalRecord } from '../report/daily.js';
import { calendarFiles } from '../report/calendar.js';
import { renderReportHtml } from '../report/html/index.js';
import { renderScheduleCsv, renderScheduleTable, scheduleJson } from '../report/schedule.js';
import { recorderJson, renderRecorderCsv, renderRecorderSvg, renderRecorderTable } from '../report/recorder.js';
import type { Week, WeekReportParts } from '../plan/week.js';
import { outPieces, type CliIo } from './io.js';
import type { CommonOptions } from './options.js';
import { BOOKING_OUTPUTS, type BookingRun } from './booking.js';

/** Fixed names plan writes (checked before the work: none may be a folder). */
export const PLAN_OUTPUTS = ['plan.json', 'contacts.csv', 'contacts.jsonl', 'daily.csv', 'sun-outages.csv', 'contacts.ics', 'report.html', 'schedule.csv', 'recorder.csv', 'recorder.svg', ...BOOKING_OUTPUTS];

/** A file made only when its turn to be written comes (its text is not held before). */
function later(name: string, make: () => string): OutputFile {
  return { name, content: { *[Symbol.iterator]() { yield make(); } } };
}

/** Shows and writes the week; `booked` is the booking run the week was made with (plan/merge --booking). */
export async function emitWeek(io: CliIo, opts: CommonOptions, week: Week, reportParts: () => WeekReportParts, stats: boolean, booked?: BookingRun): Promise<void> {
  const { plan, unscheduled, schedule, recorders, daily, dayMode, totals, allStations } = week;
  const jsonExtra = {
    daily: daily.map(dailyRecord),
    ...(allStations ? { daily_all_stations: allStations.map(allStationsDayRecord) } : {}),
    spacecraft_totals: totals.map(spacecraftTotalRecord),
    ...(schedule && recorders ? { schedule: scheduleJson(unscheduled, schedule, recorders), recorder: recorderJson(recorders) } : {}),
    ...(booked ? { booking: booked.json, recorder: recorderJson(booked.recorders) } : {}),
  };
  if (opts.format === 'json') await outPieces(io, planJsonPieces(plan, jsonExtra));
  else if (opts.format === 'csv') await outPieces(io, planCsvPieces(plan));
  else {
    await outPieces(io, planTablePieces(plan, opts.zone));
    io.out('\n' + renderDailyTable(daily, dayMode, totals, allStations));
  }
  if (opts.format === 'table' && schedule && recorders) io.out('\n' + renderScheduleTable(unscheduled, schedule, opts.zone, recorders) + '\n' + renderRecorderTable(recorders));
  if (opts.format === 'table' && booked) io.out('\n' + booked.table(opts.zone) + '\n' + renderRecorderTable(booked.recorders));
  for (const w of plan.warnings) io.err(`warning: ${w}\n`);
  if (stats) io.err(`stats: ${plan.contacts.length} contacts, ${plan.stats.linkSamples} link samples, ${plan.stats.propagations} SGP4 propagations\n`);
  if (!opts.write) return;
  const written = await writeOutputs(opts.outDir, [
    { name: 'plan.json', content: planJsonPieces(plan, jsonExtra) },
    { name: 'contacts.csv', content: planCsvPieces(plan) },
    { name: 'contacts.jsonl', content: contactsJsonLinesPieces(plan) },
    { name: 'daily.csv', content: renderDailyCsv(daily) },
    { name: 'sun-outages.csv', content: renderSunOutagesCsv(plan) },
    ...(schedule && recorders
      ? [
          { name: 'schedule.csv', content: renderScheduleCsv(unscheduled, schedule) },
          { name: 'recorder.csv', content: renderRecorderCsv(recorders) },
          { name: 'recorder.svg', content: renderRecorderSvg(recorders) },
        ]
      : []),
    ...(booked ? [...booked.files, { name: 'recorder.csv', content: renderRecorderCsv(booked.recorders) }, { name: 'recorder.svg', content: renderRecorderSvg(booked.recorders) }] : []),
    ...calendarFiles(plan),
    later('report.html', () => {
      const parts = reportParts();
      return renderReportHtml({
        plan,
        dayMode,
        daily,
        spacecraftTotals: totals,
        series: parts.series,
        margins: parts.margins.map((m) => ({
          station: m.station,
          spacecraft: m.spacecraft,
          maskMarginDb: m.maskMarginDb,
          worstSeenMarginDb: m.worstSeenMarginDb ?? Number.NaN,
          pass: m.pass,
          notVisible: m.result === 'not visible',
        })),
        ...(recorders ? { recorderSvg: renderRecorderSvg(recorders) } : {}),
        passViews: parts.passViews,
        losses: [
          ...(schedule ? schedule.spacecraft.map((l) => ({ spacecraftId: l.spacecraftId, offeredBits: l.offeredBits, lostBits: l.lostBits, cause: 'the antenna schedule' })) : []),
          ...(recorders ? recorders.tracks.map((t) => ({ spacecraftId: t.spacecraftId, offeredBits: t.generatedBits, lostBits: t.lostBits, cause: 'a full recorder' })) : []),
        ],
        provenance: parts.provenance,
      });
    }),
  ]);
  if (opts.format === 'table') io.out(`\nwrote ${written.join(', ')}\n`);
}

/** `passbudget plan`: contact windows, volume per contact, report files under --out. */
import type { Command } from 'commander';
import { assertPreflight, withNamedProblems } from '../plan/preflight.js';
import { runPlanParallel } from '../plan/parallel.js';
import type { DayMode } from '../plan/daily.js';
import { planWeek, weekReportParts } from '../plan/week.js';
import { emitWeek, PLAN_OUTPUTS } from './plan-output.js';
import { countHook, progressLine } from './progress.js';
import { addCommonOptions, parseShardFlag, prepareOutput, readCommonOptions, spanFor, withAvailability, loadScenarioNoting, withExamples } from './options.js';
import { DEFAULT_LINK_STEP_S } from '../plan/link.js';
import { shardScenario } from '../plan/shard.js';
import { SHARD_FORMAT, shardFileContent, shardFileName, type ShardHeader } from '../report/shard.js';
import { makeTempDir, removeTempDir, writeOutputs } from '../report/write.js';
import { releaseContactTexts } from '../report/contact-store.js';
import { existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { packageVersion } from '../scenario/paths.js';
import { UsageError } from '../errors.js';
import type { CliIo } from './io.js';
import type { SetExit } from './commands.js';
import { readBooking, runBooking } from './booking.js';

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
    .option('--stats', 'print the work done on stderr: contacts, link samples, SGP4 propagations')
    .option('--shard <K/N>', 'plan only the spacecraft of shard K of N (stable by spacecraft id) and write that partial result; combine all N with `passbudget merge`')
    .option('--booking <file>', 'book track periods by the rules of this file (requirements, station rules, antenna mechanics) instead of whole windows')
    .action(async (raw: Parameters<typeof readCommonOptions>[0] & { localDays?: boolean; schedule?: boolean; oneStationAtATime?: boolean; stats?: boolean; shard?: string; booking?: string }) => {
      const opts = readCommonOptions(raw);
      const shard = raw.shard !== undefined ? parseShardFlag(raw.shard) : undefined;
      if (shard && !opts.write) throw new UsageError('--shard writes its partial result under --out; it cannot be used with --no-write');
      if (shard && raw.booking !== undefined) throw new UsageError('--shard plans the contacts only; give --booking to passbudget merge');
      prepareOutput(opts, io, shard ? [shardFileName(shard)] : PLAN_OUTPUTS);
      const dayMode: DayMode = raw.localDays ? { kind: 'local' } : { kind: 'utc' };
      const scenario = withAvailability(loadScenarioNoting(opts.files, io), opts.availabilityPercent);
      const rules = await readBooking(raw.booking, scenario);
      const span = spanFor(opts, scenario, io);
      assertPreflight(scenario, span); // file and field of a model-range problem, before any work
      const progress = progressLine(io, 'plan');
      const everyWindow = !shard && !rules && !raw.schedule && !raw.oneStationAtATime;
      const renderTexts = everyWindow && (opts.write || opts.format !== 'table');
      // the workers' texts wait on disk, beside the outputs (or in the system's temp folder), until written
      const spillDir = renderTexts ? makeTempDir(opts.write && existsSync(opts.outDir) ? opts.outDir : tmpdir(), 'contact-texts') : undefined;
      try {
        const unscheduled = await withNamedProblems(scenario, span, () =>
          runPlanParallel(shard ? shardScenario(scenario, shard) : scenario, span, {
            ...(opts.stepS !== undefined ? { linkStepS: opts.stepS } : {}),
            onProgress: countHook(progress, 'stage'),
            // the workers render the contacts' texts when every window is shown and written or printed whole
            renderTexts,
            ...(spillDir !== undefined ? { spillDir } : {}),
            // and their spacecraft's own figures: volume counted once, margin rows for the report
            weekParts: shard ? 'none' : opts.write ? 'margins' : everyWindow ? 'unique' : 'none',
            slimContacts: everyWindow,
          }),
        );
        progress.end();
        if (shard) {
          const header: ShardHeader = {
            format: SHARD_FORMAT,
            version: packageVersion(),
            shard,
            fromMs: span.startMs,
            toMs: span.endMs,
            linkStepS: unscheduled.linkStepS,
            availabilityPercent: unscheduled.availabilityPercent,
            spacecraft: unscheduled.spacecraft.map((s) => s.id),
          };
          const [path] = await writeOutputs(opts.outDir, [{ name: shardFileName(shard), content: shardFileContent(header, unscheduled) }]);
          for (const w of unscheduled.warnings) io.err(`warning: ${w}\n`);
          io.out(`wrote ${path}: shard ${shard.index} of ${shard.count}, ${header.spacecraft.length} spacecraft, ${unscheduled.contacts.length} contacts; combine all ${shard.count} with passbudget merge\n`);
          setExit(0);
          return;
        }
        const booked = rules ? await runBooking(unscheduled, scenario, rules) : undefined;
        const week = planWeek(scenario, unscheduled, { dayMode, schedule: Boolean(raw.schedule), oneStationAtATime: Boolean(raw.oneStationAtATime) }, booked);
        await emitWeek(io, opts, week, () => weekReportParts(scenario, span, week), Boolean(raw.stats), booked);
        releaseContactTexts(unscheduled);
        setExit(booked ? booked.exitCode : 0);
      } finally {
        if (spillDir !== undefined) removeTempDir(spillDir);
      }
    });
}

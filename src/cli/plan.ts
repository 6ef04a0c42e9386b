/** `passbudget plan`: contact windows, volume per contact, report files under --out. */
import type { Command } from 'commander';
import { loadScenario } from '../scenario/load.js';
import { assertPreflight, withNamedProblems } from '../plan/preflight.js';
import { runPlanParallel } from '../plan/parallel.js';
import type { DayMode } from '../plan/daily.js';
import { planWeek, weekReportParts } from '../plan/week.js';
import { emitWeek, PLAN_OUTPUTS } from './plan-output.js';
import { countHook, progressLine } from './progress.js';
import { addCommonOptions, parseShardFlag, prepareOutput, readCommonOptions, spanFor, withAvailability } from './options.js';
import { shardScenario } from '../plan/shard.js';
import { SHARD_FORMAT, shardFileContent, shardFileName, type ShardHeader } from '../report/shard.js';
import { writeOutputs } from '../report/write.js';
import { packageVersion } from '../scenario/paths.js';
import { UsageError } from '../errors.js';
import type { CliIo } from './io.js';
import type { SetExit } from './commands.js';

export function registerPlan(program: Command, io: CliIo, setExit: SetExit): void {
  addCommonOptions(
    program.command('plan').description('contact windows of every spacecraft over every station, with the data volume of each contact'),
  )
    .option('--local-days', "daily totals over each station's local days (its IANA zone) instead of UTC days")
    .option('--schedule', 'deconflict antennas (priority x volume), show only the windows taken, simulate the onboard recorders')
    .option('--one-station-at-a-time', 'with --schedule: a spacecraft downlinks to one station at a time')
    .option('--stats', 'print the work done on stderr: contacts, link samples, SGP4 propagations')
    .option('--shard <K/N>', 'plan only the spacecraft of shard K of N (stable by spacecraft id) and write that partial result; combine all N with `passbudget merge`')
    .action(async (raw: Parameters<typeof readCommonOptions>[0] & { localDays?: boolean; schedule?: boolean; oneStationAtATime?: boolean; stats?: boolean; shard?: string }) => {
      const opts = readCommonOptions(raw);
      const shard = raw.shard !== undefined ? parseShardFlag(raw.shard) : undefined;
      if (shard && !opts.write) throw new UsageError('--shard writes its partial result under --out; it cannot be used with --no-write');
      prepareOutput(opts, io, shard ? [shardFileName(shard)] : PLAN_OUTPUTS);
      const dayMode: DayMode = raw.localDays ? { kind: 'local' } : { kind: 'utc' };
      const scenario = withAvailability(loadScenario(opts.files), opts.availabilityPercent);
      const span = spanFor(opts, scenario, io);
      assertPreflight(scenario, span); // file and field of a model-range problem, before any work
      const progress = progressLine(io, 'plan');
      const unscheduled = await withNamedProblems(scenario, span, () =>
        runPlanParallel(shard ? shardScenario(scenario, shard) : scenario, span, {
          ...(opts.stepS !== undefined ? { linkStepS: opts.stepS } : {}),
          onProgress: countHook(progress, 'stage'),
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
      const week = planWeek(scenario, unscheduled, { dayMode, schedule: Boolean(raw.schedule), oneStationAtATime: Boolean(raw.oneStationAtATime) });
      await emitWeek(io, opts, week, () => weekReportParts(scenario, span, week), Boolean(raw.stats));
      setExit(0);
    });
}

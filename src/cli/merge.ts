/**
 * `passbudget merge DIR...`: combines the partial results of `plan --shard K/N` (every
 * shard 1..N, each once) into exactly the outputs of the single run. It takes the same
 * scenario flags as the shards did (spacecraft and network files, --from, --days, --step,
 * --availability)
 * and plan's output flags; each shard is checked against them (span, step, the spacecraft
 * its number holds) before anything is written.
 */
import type { Command } from 'commander';
import { ScenarioError, type Problem } from '../errors.js';
import { mergePlans } from '../plan/parallel.js';
import { DEFAULT_LINK_STEP_S } from '../plan/link.js';
import { shardScenario } from '../plan/shard.js';
import { planWeek, weekReportParts } from '../plan/week.js';
import type { DayMode } from '../plan/daily.js';
import { packageVersion } from '../scenario/paths.js';
import { readShardFile, shardPaths, type ShardFile } from '../scenario/shard-file.js';
import { isoUtc } from '../time/format.js';
import { addCommonOptions, loadScenarioNoting, prepareOutput, readCommonOptions, spanFor, withAvailability } from './options.js';
import { readBooking, runBooking } from './booking.js';
import { emitWeek, PLAN_OUTPUTS } from './plan-output.js';
import type { CliIo } from './io.js';
import type { SetExit } from './commands.js';
import type { Scenario, Span } from '../scenario/types.js';

/** Every problem with the shard set, at once: missing or doubled numbers, other spans, steps or spacecraft. */
function checkShards(shards: readonly ShardFile[], scenario: Scenario, span: Span, linkStepS: number): Problem[] {
  const problems: Problem[] = [];
  const count = shards[0]!.header.shard.count;
  const seen = new Map<number, string>();
  for (const s of shards) {
    const h = s.header;
    if (h.shard.count !== count) problems.push({ file: s.file, path: 'shard', message: `is ${h.shard.index}/${h.shard.count}; the other shards are of ${count}` });
    const other = seen.get(h.shard.index);
    if (other !== undefined) problems.push({ file: s.file, path: 'shard', message: `${h.shard.index}/${h.shard.count} is given twice (also ${other})` });
    seen.set(h.shard.index, s.file);
    if (h.fromMs !== span.startMs || h.toMs !== span.endMs) {
      problems.push({ file: s.file, path: 'span', message: `planned ${isoUtc(h.fromMs, 0)} .. ${isoUtc(h.toMs, 0)}; merge was given ${isoUtc(span.startMs, 0)} .. ${isoUtc(span.endMs, 0)} (give merge the same --from and --days)` });
    }
    if (h.availabilityPercent !== scenario.link.availabilityPercent) {
      problems.push({ file: s.file, path: 'availabilityPercent', message: `planned at ${h.availabilityPercent} % availability; merge was given ${scenario.link.availabilityPercent} % (give merge the same --availability)` });
    }
    if (h.linkStepS !== linkStepS) problems.push({ file: s.file, path: 'linkStepS', message: `sampled the link every ${h.linkStepS} s; merge was given ${linkStepS} s (give merge the same --step)` });
    const expected = shardScenario(scenario, h.shard).spacecraft.map((sc) => sc.id);
    if (expected.join('\n') !== h.spacecraft.join('\n')) {
      problems.push({ file: s.file, path: 'spacecraft', message: `holds ${h.spacecraft.length} spacecraft, but the spacecraft file puts ${expected.length} in shard ${h.shard.index}/${h.shard.count} (give merge the spacecraft file the shards planned)` });
    }
  }
  const missing: number[] = [];
  for (let k = 1; k <= count; k++) if (!seen.has(k)) missing.push(k);
  if (missing.length > 0) problems.push({ file: shards[0]!.file, path: 'shard', message: `shard${missing.length > 1 ? 's' : ''} ${missing.join(', ')} of ${count} missing; merge needs all ${count}` });
  return problems;
}

export function registerMerge(program: Command, io: CliIo, setExit: SetExit): void {
  addCommonOptions(
    program
      .command('merge')
      .argument('<paths...>', 'folders (or files) holding the shard-K-of-N.pbshard files of plan --shard K/N')
      .description('combine the partial results of plan --shard K/N into the outputs of the single plan run'),
    { formats: ['table', 'json', 'csv'], step: `the link sampling step the shards used (default: ${DEFAULT_LINK_STEP_S}s)` },
  )
    .option('--local-days', "daily totals over each station's local days (its IANA zone) instead of UTC days")
    .option('--schedule', 'deconflict antennas (priority x volume), show only the windows taken, simulate the onboard recorders')
    .option('--one-station-at-a-time', 'with --schedule: a spacecraft downlinks to one station at a time')
    .option('--stats', 'print the work done on stderr: contacts, link samples, SGP4 propagations')
    .option('--booking <file>', 'book track periods by the rules of this file (requirements, station rules, antenna mechanics) instead of whole windows')
    .action(async (paths: string[], raw: Parameters<typeof readCommonOptions>[0] & { localDays?: boolean; schedule?: boolean; oneStationAtATime?: boolean; stats?: boolean; booking?: string }) => {
      const opts = readCommonOptions(raw);
      prepareOutput(opts, io, PLAN_OUTPUTS);
      const dayMode: DayMode = raw.localDays ? { kind: 'local' } : { kind: 'utc' };
      const scenario = withAvailability(loadScenarioNoting(opts.files, io), opts.availabilityPercent);
      const rules = await readBooking(raw.booking, scenario);
      const span = spanFor(opts, scenario, io);
      const version = packageVersion();
      const shards = shardPaths(paths).map((f) => readShardFile(f, version));
      const problems = checkShards(shards, scenario, span, opts.stepS ?? DEFAULT_LINK_STEP_S);
      if (problems.length > 0) throw new ScenarioError(problems);
      const unscheduled = mergePlans(
        scenario,
        span,
        shards.map((s) => s.part),
      );
      const booked = rules ? await runBooking(unscheduled, scenario, rules) : undefined;
      const week = planWeek(scenario, unscheduled, { dayMode, schedule: Boolean(raw.schedule), oneStationAtATime: Boolean(raw.oneStationAtATime) }, booked);
      await emitWeek(io, opts, week, () => weekReportParts(scenario, span, week), Boolean(raw.stats), booked);
      setExit(booked ? booked.exitCode : 0);
    });
}

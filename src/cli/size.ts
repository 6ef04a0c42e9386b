/**
 * `passbudget size`: the inverse question (src/plan/sizing.ts for the methods).
 *  - week mode: --spacecraft-id ID --target-gbit-per-day X [--solve power|dish|symbol-rate]
 *    the smallest power / dish / symbol rate at which the span delivers X Gbit per day;
 *  - one-geometry mode: --spacecraft-id ID --station-id ID --elevation DEG (or --range-km)
 *    --target-rate-bps R: the power at which that one budget just carries R.
 * Exit 0 with an answer, 1 when the target cannot be reached, 2 on bad input.
 * Writes <out>/sizing.json unless --no-write.
 */
import { Option, type Command } from 'commander';
import { UsageError } from '../errors.js';
import { assertPreflight } from '../plan/preflight.js';
import { DEFAULT_SIZING_LINK_STEP_S, prepareSizingContext, sizeForWeek, sizePowerAtGeometry, type SolveFor, type VolumeBasis } from '../plan/sizing.js';
import { pointSizingJson, renderPointSizingText, renderWeekSizingText, weekSizingJson } from '../report/sizing.js';
import { writeOutputs } from '../report/write.js';
import { addCommonOptions, withAvailability, numberFlag, prepareOutput, readGeometryOverrides, readCommonOptions, spanFor, loadScenarioNoting, withExamples } from './options.js';
import type { CliIo } from './io.js';
import type { SetExit } from './commands.js';



interface SizeRaw {
  spacecraftId: string;
  stationId?: string;
  targetGbitPerDay?: string;
  solve: SolveFor;
  basis: VolumeBasis | 'auto';
  oneStationAtATime?: boolean;
  elevation?: string;
  rangeKm?: string;
  targetRateBps?: string;
  atmosphereDb?: string;
  pointingLossDb?: string;
  extraLossDb?: string;
}

export function registerSize(program: Command, io: CliIo, setExit: SetExit): void {
  withExamples(
    addCommonOptions(
      program
        .command('size')
        .description('inverse: the transmit power, dish or symbol rate that reaches a daily volume (week) or a rate (one geometry)'),
      { formats: ['table', 'json'], step: `link sampling step inside contacts, e.g. 30s (default: ${DEFAULT_SIZING_LINK_STEP_S}s)` },
    ),
    [
      ['passbudget size --spacecraft-id KESTREL-1 --target-gbit-per-day 100', 'the transmit power that delivers 100 Gbit a day over the demo week'],
      ['passbudget size --spacecraft-id KESTREL-1 --target-gbit-per-day 400 --solve dish --station-id FRV', "the dish FRV needs for 400 Gbit a day"],
      ['passbudget size --spacecraft-id KESTREL-1 --station-id FRV --elevation 10 --target-rate-bps 5e7', 'the power for 50 Mbit/s at 10 deg elevation'],
    ],
  )
    .requiredOption('--spacecraft-id <id>', 'spacecraft whose link is sized')
    .option('--target-gbit-per-day <x>', 'week mode: daily volume to reach, Gbit per day (mean over the span)')
    .addOption(new Option('--solve <what>', 'week mode: what to size').choices(['power', 'dish', 'symbol-rate']).default('power'))
    .option('--station-id <id>', 'dish: the station whose dish is sized (default: every station with a receive chain); one geometry: the station')
    .addOption(
      new Option('--basis <basis>', 'week mode: count volumes after the antenna schedule, or every window (auto: schedule when antennas conflict)')
        .choices(['auto', 'scheduled', 'unscheduled'])
        .default('auto'),
    )
    .option('--one-station-at-a-time', 'scheduled basis: a spacecraft downlinks to one station at a time')
    .option('--elevation <deg>', 'one-geometry mode: elevation, deg')
    .option('--range-km <km>', 'one-geometry mode: slant range, km')
    .option('--target-rate-bps <R>', 'one-geometry mode: information rate to carry, bit/s')
    .option('--atmosphere-db <dB>', 'one-geometry mode: replace the ITU-R atmosphere by this total, dB (sky noise follows from it, ITU-R P.618 sec. 3)')
    .option('--pointing-loss-db <dB>', 'one-geometry mode: replace the computed pointing loss, dB')
    .option('--extra-loss-db <dB>', 'one-geometry mode: other losses to include, dB')
    .action(async (raw: Parameters<typeof readCommonOptions>[0] & SizeRaw) => {
      const opts = readCommonOptions(raw);
      prepareOutput(opts, io, ['sizing.json']);
      const scenario = withAvailability(loadScenarioNoting(opts.files, io), opts.availabilityPercent);
      const rate = numberFlag('--target-rate-bps', raw.targetRateBps, 1e-3, 1e12);
      const target = numberFlag('--target-gbit-per-day', raw.targetGbitPerDay, 1e-9, 1e9);
      let text: string;
      let json: string;
      let reached: boolean;
      if (rate !== undefined) {
        if (raw.stationId === undefined) throw new UsageError('size: one-geometry mode (--target-rate-bps) needs --station-id');
        const req: Parameters<typeof sizePowerAtGeometry>[1] = { spacecraftId: raw.spacecraftId, stationId: raw.stationId, targetRateBps: rate };
        Object.assign(req, readGeometryOverrides(raw));
        if (raw.solve !== 'power') throw new UsageError('--solve: one-geometry mode sizes the transmit power only');
        const res = sizePowerAtGeometry(scenario, req);
        text = renderPointSizingText(res);
        json = pointSizingJson(res);
        reached = res.requiredPowerDbw !== null;
      } else if (target !== undefined) {
        for (const [flag, v] of [['--atmosphere-db', raw.atmosphereDb], ['--pointing-loss-db', raw.pointingLossDb], ['--extra-loss-db', raw.extraLossDb]] as const) {
          if (v !== undefined) throw new UsageError(`${flag}: only in one-geometry mode (--target-rate-bps with --elevation/--range-km); week mode runs the modelled budget`);
        }
        const span = spanFor(opts, scenario, io);
        assertPreflight(scenario, span);
        const ctx = prepareSizingContext(scenario, span, opts.stepS ?? DEFAULT_SIZING_LINK_STEP_S);
        const res = sizeForWeek(ctx, {
          spacecraftId: raw.spacecraftId,
          targetBitsPerDay: target * 1e9,
          solve: raw.solve,
          ...(raw.stationId !== undefined ? { stationId: raw.stationId } : {}),
          basis: raw.basis,
          oneStationAtATime: Boolean(raw.oneStationAtATime),
        });
        for (const w of ctx.basePlan.warnings) io.err(`warning: ${w}\n`);
        text = renderWeekSizingText(res, span);
        json = weekSizingJson(res, span);
        reached = res.answer !== null;
      } else {
        throw new UsageError('size: give --target-gbit-per-day X (week mode) or --target-rate-bps R with --elevation/--range-km (one geometry)');
      }
      io.out(opts.format === 'json' ? json : text);
      if (opts.write) {
        const written = await writeOutputs(opts.outDir, [{ name: 'sizing.json', content: json }]);
        if (opts.format === 'table') io.out(`\nwrote ${written.join(', ')}\n`);
      }
      // 1: the target cannot be reached (EXIT_REQUIREMENT_FAILED)
      setExit(reached ? 0 : 1);
    });
}

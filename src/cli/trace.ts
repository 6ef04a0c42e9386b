/**
 * `passbudget trace`: geometry and link budget at every step for one
 * spacecraft-station pair (--spacecraft-id and --station-id), one spacecraft or
 * one station against all of the other kind, or everything. CSV only: streamed to
 * <out>/trace.csv (atomic), or to stdout with --no-write or --format csv.
 */
import { once } from 'node:events';
import { join } from 'node:path';
import type { Command } from 'commander';
import { UsageError } from '../errors.js';
import { loadScenario } from '../scenario/load.js';
import { assertPreflight } from '../plan/preflight.js';
import { DEFAULT_TRACE_STEP_S, prepareTrace, traceRows, traceSelectionProblems, type TraceOptions } from '../plan/trace.js';
import { streamTraceCsv, traceTimeDecimals, writeTraceFile } from '../report/trace.js';
import { addCommonOptions, prepareOutput, readCommonOptions, spanFor, withAvailability } from './options.js';
import { processIo, type CliIo } from './io.js';
import { progressLine } from './progress.js';
import type { SetExit } from './commands.js';

/**
 * The sink for CSV on stdout. With the real process it waits for stdout to drain
 * (backpressure) and notices a reader that went away (EPIPE, e.g. `| head`): the
 * trace then stops quietly. Tests hand a capturing io and get plain calls.
 */
function stdoutSink(io: CliIo): { write(chunk: string): Promise<void>; closed(): boolean; dispose(): void } {
  if (io !== processIo) {
    return { write: async (chunk) => io.out(chunk), closed: () => false, dispose() {} };
  }
  const stdout = process.stdout;
  let closed = false;
  const onError = (err: NodeJS.ErrnoException) => {
    if (err.code === 'EPIPE') closed = true;
    else throw err;
  };
  stdout.on('error', onError);
  return {
    async write(chunk) {
      if (closed) throw new Error('stdout closed');
      io.out(chunk);
      if (stdout.writableNeedDrain && !closed) {
        await Promise.race([once(stdout, 'drain'), once(stdout, 'close')]);
      }
    },
    closed: () => closed,
    dispose: () => void stdout.off('error', onError),
  };
}

export function registerTrace(program: Command, io: CliIo, setExit: SetExit): void {
  addCommonOptions(
    program
      .command('trace')
      .description(
        'time series of look angles and link budget per step as CSV (one pair, one spacecraft, one station, or everything); ' +
          'written to <out>/trace.csv, or to stdout with --no-write or --format csv',
      )
      .option('--spacecraft-id <id>', 'only this spacecraft (default: all)')
      .option('--station-id <id>', 'only this station (default: all)')
      .option('--in-contact', 'keep only the rows inside contact windows'),
  ).action(async (raw) => {
    const opts = readCommonOptions(raw);
    if (opts.format === 'json') throw new UsageError('--format: trace writes CSV only (use --format csv for stdout)');
    if (opts.zone !== undefined) throw new UsageError('--zone: trace times are always UTC (column time_utc)');
    if (opts.format !== 'csv') prepareOutput(opts, io, ['trace.csv']);
    const scenario = withAvailability(loadScenario(opts.files), opts.availabilityPercent);
    const span = spanFor(opts, scenario, io);
    assertPreflight(scenario, span); // file and field of a model-range problem, before any work
    const traceOpts: TraceOptions = { stepS: opts.stepS ?? DEFAULT_TRACE_STEP_S, inContactOnly: raw.inContact === true };
    if (typeof raw.spacecraftId === 'string') traceOpts.spacecraftId = raw.spacecraftId;
    if (typeof raw.stationId === 'string') traceOpts.stationId = raw.stationId;
    const problems = traceSelectionProblems(scenario, traceOpts);
    if (problems.length > 0) throw new UsageError(problems.join('; '));
    const progress = progressLine(io, 'trace');
    traceOpts.onProgress = (p) =>
      progress.update(`spacecraft ${p.spacecraftIndex}/${p.spacecraftCount} (${p.spacecraftId}) ${Math.floor(p.fraction * 100)} %`, p.fraction === 0);
    const trace = prepareTrace(scenario, span, traceOpts);
    const toStdout = !opts.write || opts.format === 'csv';
    try {
      if (toStdout) {
        const sink = stdoutSink(io);
        try {
          await streamTraceCsv(traceRows(trace), traceTimeDecimals(span.startMs, trace.stepMs), (chunk) => sink.write(chunk));
        } catch (err) {
          if (!sink.closed()) throw err; // the reader went away: not an error of ours
        } finally {
          sink.dispose();
        }
      } else {
        const written = await writeTraceFile(join(opts.outDir, 'trace.csv'), trace, traceRows(trace));
        progress.end();
        io.out(
          `wrote ${written.path}: ${written.rows} rows (${trace.spacecraftIds.length} spacecraft x ${trace.stationIds.length} stations, ` +
            `${trace.steps} steps of ${trace.stepS} s${trace.inContactOnly ? ', in contact only' : ''})\n`,
        );
      }
    } finally {
      progress.end();
    }
    for (const w of trace.warnings) io.err(`warning: ${w}\n`);
    setExit(0);
  });
}

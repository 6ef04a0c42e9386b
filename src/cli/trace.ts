/**
 * `passbudget trace`: geometry and link budget at every step for one
 * spacecraft-station pair (--spacecraft-id and --station-id), one spacecraft or
 * one station against all of the other kind, or everything. CSV only: streamed to
 * <out>/trace.csv or --output FILE (atomic), or to stdout with --output - (or --no-write).
 */
import { once } from 'node:events';
import { basename, dirname, join } from 'node:path';
import type { Command } from 'commander';
import { UsageError } from '../errors.js';
import { assertPreflight } from '../plan/preflight.js';
import { DEFAULT_TRACE_STEP_S, prepareTrace, traceRows, traceSelectionProblems, type TraceOptions } from '../plan/trace.js';
import { streamTraceCsv, traceTimeDecimals, writeTraceFile } from '../report/trace.js';
import { addCommonOptions, prepareOutput, readCommonOptions, spanFor, withAvailability, loadScenarioNoting, withExamples } from './options.js';
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
  withExamples(
    addCommonOptions(
      program
        .command('trace')
        .description(
          'time series of look angles and link budget per step as CSV (one pair, one spacecraft, one station, or everything); ' +
            'written to <out>/trace.csv, another file with --output, or stdout with --output -',
        )
        .option('--spacecraft-id <id>', 'only this spacecraft (default: all)')
        .option('--station-id <id>', 'only this station (default: all)')
        .option('--in-contact', 'keep only the rows inside contact windows')
        .option('--output <file>', 'CSV file to write, "-" for stdout (default: <out>/trace.csv)'),
      { formats: [], step: `time step, e.g. 1s, 1m (default: ${DEFAULT_TRACE_STEP_S}s)` },
    ),
    [
      ['passbudget trace --spacecraft-id KESTREL-1 --station-id FRV --days 1 --in-contact --output -', 'one pair, one day, the rows inside contacts, on stdout'],
      ['passbudget trace --spacecraft-id KESTREL-1 --step 1s --output kestrel.csv', 'one spacecraft against every station at 1 s, to kestrel.csv'],
      ['passbudget trace', 'everything in the demo week at 10 s, to out/trace.csv'],
    ],
  ).action(async (raw) => {
    const opts = readCommonOptions(raw);
    if (opts.zone !== undefined) throw new UsageError('--zone: trace times are always UTC (column time_utc)');
    const output = typeof raw.output === 'string' ? raw.output : undefined;
    if (output === '') throw new UsageError('--output: "" is not a file name; valid: a file path, or "-" for stdout');
    const toStdout = !opts.write || output === '-';
    const file = output !== undefined && output !== '-' ? output : join(opts.outDir, 'trace.csv');
    if (!toStdout) prepareOutput({ ...opts, outDir: dirname(file) }, io, [basename(file)]);
    const scenario = withAvailability(loadScenarioNoting(opts.files, io), opts.availabilityPercent);
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
        const written = await writeTraceFile(file, trace, traceRows(trace));
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

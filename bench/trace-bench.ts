/**
 * Trace throughput and memory: the whole demo (every spacecraft x every station)
 * over its week at a given step, streamed to a CSV file. Reports wall time, rows,
 * bytes and peak RSS (process.resourceUsage().maxRSS), plus the RSS seen at each
 * progress report to show that memory stays flat while streaming.
 *
 * Run alone: npm run build && node dist/bench/trace-bench.js [stepS] [outFile]
 * (defaults 1 s and /tmp/passbudget-trace-bench.csv; the file is removed afterwards
 * unless an outFile is given). Or call benchTrace() from bench/bench.ts.
 */
import { isEntryModule } from '../src/cli/entry.js';
import { statSync, rmSync } from 'node:fs';
import { loadScenario } from '../src/scenario/load.js';
import { demoFiles } from '../src/scenario/paths.js';
import { prepareTrace, traceRows } from '../src/plan/trace.js';
import { writeTraceFile } from '../src/report/trace.js';

export interface TraceBenchResult {
  stepS: number;
  pairs: number;
  steps: number;
  rows: number;
  bytes: number;
  wallS: number;
  /** CPU time of the process (user + system) over the run, s: wall time on a quiet machine. */
  cpuS: number;
  rowsPerS: number;
  peakRssMb: number;
  /** RSS (MB) at each progress report, in order. */
  rssSamplesMb: number[];
}

export async function benchTrace(stepS = 1, outFile = '/tmp/passbudget-trace-bench.csv', keep = false): Promise<TraceBenchResult> {
  const scenario = loadScenario(demoFiles());
  if (!scenario.span) throw new Error('trace-bench: the demo scenario has no window');
  const rssSamplesMb: number[] = [];
  const t0 = performance.now();
  const cpu0 = process.cpuUsage();
  const trace = prepareTrace(scenario, scenario.span, {
    stepS,
    onProgress: () => rssSamplesMb.push(Math.round(process.memoryUsage.rss() / 1e6)),
  });
  const written = await writeTraceFile(outFile, trace, traceRows(trace));
  const wallS = (performance.now() - t0) / 1000;
  const cpu = process.cpuUsage(cpu0);
  const cpuS = (cpu.user + cpu.system) / 1e6;
  const bytes = statSync(written.path).size;
  if (!keep) rmSync(written.path, { force: true });
  return {
    stepS,
    pairs: trace.pairs,
    steps: trace.steps,
    rows: written.rows,
    bytes,
    wallS,
    cpuS,
    rowsPerS: written.rows / wallS,
    peakRssMb: process.resourceUsage().maxRSS / 1024,
    rssSamplesMb,
  };
}


if (isEntryModule(import.meta.url)) {
  const stepS = Number(process.argv[2] ?? '1');
  const outFile = process.argv[3];
  const r = await benchTrace(stepS, outFile ?? '/tmp/passbudget-trace-bench.csv', outFile !== undefined);
  const rss = r.rssSamplesMb;
  process.stdout.write(
    `trace week, ${r.pairs} pairs x ${r.steps} steps at ${r.stepS} s: ${r.rows} rows, ${(r.bytes / 1e9).toFixed(2)} GB, ` +
      `${r.wallS.toFixed(1)} s wall, ${r.cpuS.toFixed(1)} s CPU (${Math.round(r.rowsPerS)} rows/s wall), peak RSS ${r.peakRssMb.toFixed(0)} MB ` +
      `(RSS during streaming ${Math.min(...rss)}..${Math.max(...rss)} MB over ${rss.length} reports)\n`,
  );
}

/**
 * Flags every command shares, turned into checked values. A bad flag value is
 * a UsageError naming the flag, the value and what is valid (exit 2).
 */
import { Command, Option } from 'commander';
import { IANAZone } from 'luxon';
import { UsageError } from '../errors.js';
import { demoFiles } from '../scenario/paths.js';
import { INSTANT_RANGE_TEXT, loadScenario, parseInstant, type ScenarioFiles } from '../scenario/load.js';
import { parseDurationS } from '../time/duration.js';
import type { Scenario, Span } from '../scenario/types.js';
import type { CliIo } from './io.js';
import { checkOutputDir } from '../report/outdir.js';
import { MAX_SHARDS, type ShardSpec } from '../plan/shard.js';

/**
 * A plain decimal number as a flag value: digits, an optional point and exponent
 * ("16", "0.5", "1e3"); no hex ("0x10"), binary, blanks or Infinity.
 */
export function decimalFlag(flag: string, text: string | undefined, min: number, max: number, valid = `a decimal number in ${min}..${max}`): number | undefined {
  if (text === undefined) return undefined;
  const t = text.trim();
  const v = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/.test(t) ? Number(t) : Number.NaN;
  if (!Number.isFinite(v) || v < min || v > max) throw new UsageError(`${flag}: ${JSON.stringify(text)} must be ${valid}`);
  return v;
}

/**
 * Checks --out before any work (src/report/outdir.ts): one line and exit 2 when
 * it cannot take the files `names`; removes stale temp files of stopped runs.
 * Nothing to check with --no-write.
 */
export function prepareOutput(opts: CommonOptions, io: CliIo, names: readonly string[] = []): void {
  if (opts.write) checkOutputDir(opts.outDir, { names, note: (line) => io.err(line) });
}

export type Format = 'table' | 'json' | 'csv';

export interface CommonOptions {
  files: ScenarioFiles;
  fromMs?: number;
  days?: number;
  stepS?: number;
  outDir: string;
  format: Format;
  zone?: string;
  write: boolean;
  /** --availability: the link availability, % (replaces the spacecraft file's). */
  availabilityPercent?: number;
}

/** Help text of --availability (plan, trace, margin, size, budget). */
export const AVAILABILITY_HELP = "link availability, % of an average year the budget holds (90..99.999; default: the spacecraft file's link.availabilityPercent, else 99.5)";

/** Reads --availability (UsageError when outside what the spacecraft file may hold). */
export function availabilityFlag(text: string | undefined): number | undefined {
  return decimalFlag('--availability', text, 90, 99.999, 'a percentage in 90..99.999');
}

/** The scenario with --availability applied (the flag wins over the spacecraft file). */
export function withAvailability(scenario: Scenario, availabilityPercent: number | undefined): Scenario {
  if (availabilityPercent !== undefined) scenario.link = { ...scenario.link, availabilityPercent };
  return scenario;
}

export interface CommonOptionSet {
  /** The formats this command prints (the first is the default); none: no --format flag. */
  formats: readonly Format[];
  /** What --step means here and its default, for the help text. */
  step: string;
}

export function addCommonOptions(cmd: Command, set: CommonOptionSet): Command {
  cmd
    .option('--spacecraft <file>', 'spacecraft file (JSON or YAML) (default: the bundled demo fleet)')
    .option('--network <file>', 'ground network file (JSON or YAML) (default: the bundled demo network)')
    .option('--from <iso>', "start of the window, ISO 8601, UTC unless a zone is given (default: the spacecraft file's window, else today 00:00 UTC)")
    .option('--days <n>', "length of the window in days (default: the spacecraft file's window, else 7)")
    .option('--step <duration>', set.step)
    .option('--out <dir>', 'output folder', 'out');
  if (set.formats.length > 0) cmd.addOption(new Option('--format <format>', 'terminal output format').choices([...set.formats]).default(set.formats[0]));
  return cmd
    .option('--zone <iana>', 'show times and days in this IANA time zone (default: UTC)')
    .option('--availability <percent>', AVAILABILITY_HELP)
    .option('--no-write', 'print only; write no files under --out');
}

interface RawOptions {
  spacecraft?: string;
  network?: string;
  from?: string;
  days?: string;
  step?: string;
  out: string;
  format?: Format;
  zone?: string;
  write: boolean;
  availability?: string;
}

export function readCommonOptions(raw: RawOptions): CommonOptions {
  const demo = demoFiles();
  const opts: CommonOptions = {
    files: { spacecraftFile: raw.spacecraft ?? demo.spacecraftFile, networkFile: raw.network ?? demo.networkFile },
    outDir: raw.out,
    format: raw.format ?? 'table',
    write: raw.write,
  };
  if (raw.from !== undefined) {
    const t = parseInstant(raw.from);
    if (t === undefined) throw new UsageError(`--from: "${raw.from}" is not an ISO 8601 time from ${INSTANT_RANGE_TEXT} (e.g. 2026-03-05T00:00:00Z)`);
    opts.fromMs = t;
  }
  if (raw.days !== undefined) {
    const d = decimalFlag('--days', raw.days, 0, 366, 'a number of days in (0, 366]');
    if (d === undefined || d <= 0) throw new UsageError(`--days: "${raw.days}" must be a number of days in (0, 366]`);
    opts.days = d;
  }
  if (raw.step !== undefined) {
    const s = parseDurationS(raw.step);
    if (s === undefined || s < 0.1 || s > 3600) throw new UsageError(`--step: "${raw.step}" must be a duration from 0.1s to 1h (e.g. 1s, 10s, 1m)`);
    opts.stepS = s;
  }
  const availability = availabilityFlag(raw.availability);
  if (availability !== undefined) opts.availabilityPercent = availability;
  if (raw.zone !== undefined) {
    if (!IANAZone.isValidZone(raw.zone)) throw new UsageError(`--zone: "${raw.zone}" is not an IANA time zone (e.g. Europe/Oslo, UTC)`);
    opts.zone = raw.zone;
  }
  return opts;
}

/**
 * The span to walk: --from/--days, else the scenario's own window, else
 * today 00:00 UTC for 7 days (the clock is read only here, by the CLI).
 */
export function spanFor(opts: CommonOptions, scenario: Scenario, io: CliIo): Span {
  const days = opts.days ?? (scenario.span ? (scenario.span.endMs - scenario.span.startMs) / 86_400_000 : 7);
  let startMs = opts.fromMs ?? scenario.span?.startMs;
  if (startMs === undefined) {
    startMs = Math.floor(io.nowMs() / 86_400_000) * 86_400_000;
    io.err(`note: no --from and no window in the spacecraft file: starting today, ${new Date(startMs).toISOString().slice(0, 10)} 00:00 UTC\n`);
  }
  return { startMs, endMs: startMs + days * 86_400_000 };
}

/** A decimal number flag in min..max (decimal only: "0x10" or " " is not a number here). */
export function numberFlag(flag: string, text: string | undefined, min: number, max: number): number | undefined {
  return decimalFlag(flag, text, min, max, `a number in ${min}..${max}`);
}

/** The one-geometry flags `budget` and `size` share: where the link is evaluated and the handbook overrides. */
export interface GeometryOverrideFlags {
  elevation?: string;
  rangeKm?: string;
  atmosphereDb?: string;
  pointingLossDb?: string;
  extraLossDb?: string;
}

export function readGeometryOverrides(raw: GeometryOverrideFlags): {
  elevationDeg?: number;
  rangeKm?: number;
  atmosphereDb?: number;
  pointingLossDb?: number;
  extraLossDb?: number;
} {
  const out: ReturnType<typeof readGeometryOverrides> = {};
  const el = numberFlag('--elevation', raw.elevation, 0, 90);
  const range = numberFlag('--range-km', raw.rangeKm, 1, 1e10);
  const atm = numberFlag('--atmosphere-db', raw.atmosphereDb, 0, 100);
  const point = numberFlag('--pointing-loss-db', raw.pointingLossDb, 0, 50);
  const extra = numberFlag('--extra-loss-db', raw.extraLossDb, 0, 100);
  if (el !== undefined) out.elevationDeg = el;
  if (range !== undefined) out.rangeKm = range;
  if (atm !== undefined) out.atmosphereDb = atm;
  if (point !== undefined) out.pointingLossDb = point;
  if (extra !== undefined) out.extraLossDb = extra;
  return out;
}

/** "--shard K/N": shard K (1..N) of N (plan/shard.ts). */
export function parseShardFlag(text: string): ShardSpec {
  const m = /^(\d{1,5})\/(\d{1,5})$/.exec(text.trim());
  const index = m ? Number(m[1]) : Number.NaN;
  const count = m ? Number(m[2]) : Number.NaN;
  if (!(count >= 1 && count <= MAX_SHARDS && index >= 1 && index <= count)) {
    throw new UsageError(`--shard: ${JSON.stringify(text)} must be K/N with 1 <= K <= N <= ${MAX_SHARDS} (e.g. 3/8)`);
  }
  return { index, count };
}

/** Loads the scenario (every problem at once, ScenarioError) and prints its notes and warnings to stderr. */
export function loadScenarioNoting(files: ScenarioFiles, io: CliIo): Scenario {
  const scenario = loadScenario(files);
  for (const n of scenario.notices) io.err(`${n.level}: ${n.message}\n`);
  return scenario;
}

/** Appends "Examples:" to a command's --help: [command line, what it does]. */
export function withExamples(cmd: Command, examples: readonly (readonly [string, string])[]): Command {
  const lines = examples.map(([line, what]) => `  $ ${line}\n      ${what}`);
  return cmd.addHelpText('after', `\nExamples:\n${lines.join('\n')}\n`);
}

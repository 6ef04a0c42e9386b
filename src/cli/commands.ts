/**
 * Registers the passbudget commands on the program. Each command's module (and what it
 * imports: the scenario loader, the link engine, the report writers) is loaded only when
 * needed: for `passbudget <command> ...` only that command's, for anything else (help,
 * version, an unknown command) all of them, so start-up does no unnecessary work.
 */
import type { Command } from 'commander';
import type { CliIo } from './io.js';
export type SetExit = (code: number) => void;

type Register = (program: Command, io: CliIo, setExit: SetExit) => void;

/** Command modules in the order help lists them: the command names each registers, and its loader. */
const MODULES: readonly (readonly [readonly string[], () => Promise<Register>])[] = [
  [['plan'], async () => (await import('./plan.js')).registerPlan],
  [['check'], async () => (await import('./check.js')).registerCheck],
  [['trace'], async () => (await import('./trace.js')).registerTrace],
  [['margin'], async () => (await import('./margin.js')).registerMargin],
  [['budget'], async () => (await import('./budget.js')).registerBudget],
  [['size'], async () => (await import('./size.js')).registerSize],
  [['climate'], async () => (await import('./climate.js')).registerClimate],
  [['merge'], async () => (await import('./merge.js')).registerMerge],
  [['schema', 'codes'], async () => (await import('./reference.js')).registerReference],
];

export async function registerCommands(program: Command, io: CliIo, setExit: SetExit, argv: readonly string[] = []): Promise<void> {
  const first = argv[0];
  if (argv.length === 1 && (first === '--version' || first === '-V')) return; // the version needs no command
  const named = MODULES.filter(([names]) => first !== undefined && names.includes(first));
  const chosen = named.length > 0 ? named : MODULES;
  const registers = await Promise.all(chosen.map(([, load]) => load()));
  for (const register of registers) register(program, io, setExit);
}

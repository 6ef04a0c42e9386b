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

/** Command name -> its module's register function, in the order help lists them. */
const COMMANDS: Record<string, () => Promise<Register>> = {
  plan: async () => (await import('./plan.js')).registerPlan,
  check: async () => (await import('./check.js')).registerCheck,
  trace: async () => (await import('./trace.js')).registerTrace,
  margin: async () => (await import('./margin.js')).registerMargin,
  budget: async () => (await import('./budget.js')).registerBudget,
  size: async () => (await import('./size.js')).registerSize,
  climate: async () => (await import('./climate.js')).registerClimate,
  merge: async () => (await import('./merge.js')).registerMerge,
};

export async function registerCommands(program: Command, io: CliIo, setExit: SetExit, argv: readonly string[] = []): Promise<void> {
  const first = argv[0];
  const names = first !== undefined && Object.hasOwn(COMMANDS, first) ? [first] : Object.keys(COMMANDS);
  const registers = await Promise.all(names.map((n) => COMMANDS[n]!()));
  for (const register of registers) register(program, io, setExit);
}

/** Registers every passbudget command on the program. */
import type { Command } from 'commander';
import type { CliIo } from './io.js';
import { registerCheck } from './check.js';
import { registerPlan } from './plan.js';
import { registerTrace } from './trace.js';
import { registerMargin } from './margin.js';
import { registerBudget } from './budget.js';
import { registerSize } from './size.js';
import { registerClimate } from './climate.js';
import { registerReference } from './reference.js';

export type SetExit = (code: number) => void;

export function registerCommands(program: Command, io: CliIo, setExit: SetExit): void {
  registerPlan(program, io, setExit);
  registerCheck(program, io, setExit);
  registerTrace(program, io, setExit);
  registerMargin(program, io, setExit);
  registerBudget(program, io, setExit);
  registerSize(program, io, setExit);
  registerClimate(program, io, setExit);
  registerReference(program, io, setExit);
}

#!/usr/bin/env node
/**
 * passbudget command line. Parses flags, calls the stages, hands results to a
 * renderer. Holds no physics. Exit codes: 0 ok, 1 a requirement failed,
 * 2 bad input (one line per problem, never a stack trace).
 */
import { isEntryModule } from './entry.js';
import { Command, CommanderError } from 'commander';
import { ScenarioError, ModelRangeError, UsageError, OutputError, problemLines } from '../errors.js';
import { processIo, type CliIo } from './io.js';
import { registerCommands } from './commands.js';
import { installStopHandlers } from './signals.js';
import { packageVersion } from '../scenario/paths.js';

export const EXIT_OK = 0;
export const EXIT_REQUIREMENT_FAILED = 1;
export const EXIT_BAD_INPUT = 2;

export async function run(argv: string[], io: CliIo = processIo): Promise<number> {
  const program = new Command();
  let exitCode = EXIT_OK;
  program
    .name('passbudget')
    .description('Contact windows and a downlink budget at every second of every pass, for a week of spacecraft contacts.')
    .version(packageVersion(), '-V, --version', 'print the version of passbudget')
    .exitOverride()
    .configureOutput({ writeOut: (s) => io.out(s), writeErr: (s) => io.err(s) })
    .showHelpAfterError(false)
    .addHelpText(
      'after',
      '\nFirst steps:\n' +
        '  $ passbudget plan                      the bundled demo week (invented fleet and network)\n' +
        '  $ passbudget check --spacecraft examples/cubesat.yaml --network examples/one-dish.yaml\n' +
        '  $ passbudget plan --spacecraft examples/cubesat.yaml --network examples/one-dish.yaml --no-write\n' +
        '  $ passbudget schema spacecraft         the field reference, as JSON Schema\n' +
        '  $ passbudget <command> --help          defaults and examples of each command\n',
    );
  try {
    await registerCommands(
      program,
      io,
      (code) => {
        exitCode = code;
      },
      argv,
    );
    await program.parseAsync(argv, { from: 'user' });
    return exitCode;
  } catch (err) {
    return handleError(err, io);
  }
}

function handleError(err: unknown, io: CliIo): number {
  if (err instanceof CommanderError) {
    // commander has already printed its one-line message (or help / version).
    if (err.code === 'commander.helpDisplayed' || err.code === 'commander.version' || err.code === 'commander.help') return EXIT_OK;
    return EXIT_BAD_INPUT;
  }
  if (err instanceof ScenarioError) {
    for (const line of problemLines(err.problems)) io.err(`error: ${line}\n`);
    return EXIT_BAD_INPUT;
  }
  if (err instanceof ModelRangeError || err instanceof UsageError || err instanceof OutputError) {
    io.err(`error: ${err.message}\n`);
    return EXIT_BAD_INPUT;
  }
  throw err;
}


/** Runs the CLI on process.argv as the program: stop handlers, exit code, a bug's stack in full. */
export function startCli(): void {
  // Interrupted or a closed stdout: stop now, nothing new written (src/cli/signals.ts).
  installStopHandlers();
  run(process.argv.slice(2)).then(
    (code) => {
      process.exitCode = code;
    },
    (err: unknown) => {
      // A bug, not a user's mistake: show it in full.
      console.error(err);
      process.exitCode = 70;
    },
  );
}

// Run as `node dist/src/cli/main.js` unbundled (tsc's output); the build's bundle starts from cli-bundle-entry.ts.
if (isEntryModule(import.meta.url)) startCli();

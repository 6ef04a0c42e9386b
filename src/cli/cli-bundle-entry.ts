/**
 * Entry of the CLI's bundle (scripts/bundle-cli.ts): the whole `passbudget` program in one
 * script, started by dist/src/cli/main.js through launch.ts. Inside the bundle main.ts's own
 * entry check is false (its import.meta.url is the bundle's, process.argv[1] the launcher's),
 * so the program starts here, once.
 */
import { startCli } from './main.js';

startCli();

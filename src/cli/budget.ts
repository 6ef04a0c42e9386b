/** `passbudget budget`: one link budget, term by term, at an elevation or range. */
import { Command, Option } from 'commander';
import { UsageError } from '../errors.js';
import { demoFiles } from '../scenario/paths.js';
import { singleBudget, type SingleBudgetRequest } from '../plan/single.js';
import { renderBudgetTable, renderBudgetJson } from '../report/budget.js';
import type { CliIo } from './io.js';
import type { SetExit } from './commands.js';
import { AVAILABILITY_HELP, availabilityFlag, numberFlag, readGeometryOverrides, withAvailability, loadScenarioNoting, withExamples } from './options.js';

interface Raw {
  spacecraft?: string;
  network?: string;
  spacecraftId: string;
  stationId: string;
  radioId?: string;
  elevation?: string;
  rangeKm?: string;
  atmosphereDb?: string;
  pointingLossDb?: string;
  extraLossDb?: string;
  gOverTDbK?: string;
  availability?: string;
  format: 'table' | 'json';
}

export function registerBudget(program: Command, io: CliIo, setExit: SetExit): void {
  const cmd = program
    .command('budget')
    .description('one downlink budget, term by term with units and sources, at a given elevation or slant range')
    .option('--spacecraft <file>', 'spacecraft file (JSON or YAML) (default: the bundled demo fleet)')
    .option('--network <file>', 'ground network file (JSON or YAML) (default: the bundled demo network)')
    .requiredOption('--spacecraft-id <id>', 'spacecraft whose radio transmits')
    .requiredOption('--station-id <id>', 'receiving station')
    .option('--radio-id <id>', 'radio of the spacecraft (default: its first)')
    .option('--elevation <deg>', 'elevation, deg (0..90)')
    .option('--range-km <km>', 'slant range, km')
    .option('--atmosphere-db <dB>', 'replace the ITU-R atmosphere by this total, dB (to follow a handbook budget); the sky noise follows from it (ITU-R P.618 sec. 3)')
    .option('--pointing-loss-db <dB>', 'replace the computed pointing loss, dB')
    .option('--extra-loss-db <dB>', 'other losses to include, dB (e.g. a receive feeder loss)')
    .option('--availability <percent>', AVAILABILITY_HELP)
    .option('--g-over-t-db-k <dB/K>', "replace the computed G/T by this figure, dB/K (a handbook's G/T for the budget's conditions)")
    .addOption(new Option('--format <format>', 'output format').choices(['table', 'json']).default('table'))
    .option('--no-write', 'accepted for symmetry with the other commands: budget writes no files');
  withExamples(cmd, [
    ['passbudget budget --spacecraft-id KESTREL-1 --station-id FRV --elevation 10', 'the demo X-band budget at 10 deg elevation, term by term'],
    ['passbudget budget --spacecraft-id HERON-2 --station-id MDL --range-km 2000 --format json', 'at a slant range of 2,000 km, as JSON'],
    ['passbudget budget --spacecraft-id KESTREL-1 --station-id FRV --elevation 5 --atmosphere-db 2 --pointing-loss-db 0.5', "following a handbook budget's atmosphere and pointing figures"],
  ]).action((raw: Raw) => {
      const demo = demoFiles();
      const availability = availabilityFlag(raw.availability);
      const scenario = withAvailability(loadScenarioNoting({ spacecraftFile: raw.spacecraft ?? demo.spacecraftFile, networkFile: raw.network ?? demo.networkFile }, io), availability);
      const req: SingleBudgetRequest = { spacecraftId: raw.spacecraftId, stationId: raw.stationId };
      if (raw.radioId !== undefined) req.radioId = raw.radioId;
      Object.assign(req, readGeometryOverrides(raw));
      const gt = numberFlag('--g-over-t-db-k', raw.gOverTDbK, -40, 70);
      if (gt !== undefined) req.gOverTDbK = gt;
      const b = singleBudget(scenario, req);
      io.out(raw.format === 'json' ? renderBudgetJson(b) : renderBudgetTable(b));
      setExit(0);
    });
}

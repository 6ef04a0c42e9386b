/** `passbudget check`: validate scenario files and report every problem at once. */
import type { Command } from 'commander';
import { demoFiles } from '../scenario/paths.js';
import { ScenarioError } from '../errors.js';
import { preflight } from '../plan/preflight.js';
import type { CliIo } from './io.js';
import { loadScenarioNoting } from './options.js';
import type { SetExit } from './commands.js';
import { climateReports } from './climate.js';
import { linkExceedancePercent } from '../plan/link.js';
import { renderClimateTable } from '../report/climate.js';

export function registerCheck(program: Command, io: CliIo, setExit: SetExit): void {
  program
    .command('check')
    .description('validate spacecraft and network files; print every problem, one per line (exit 2 if any)')
    .option('--spacecraft <file>', 'spacecraft file (JSON or YAML); default: the bundled demo fleet')
    .option('--network <file>', 'ground network file (JSON or YAML); default: the bundled demo network')
    .action((raw: { spacecraft?: string; network?: string }) => {
      const demo = demoFiles();
      const files = { spacecraftFile: raw.spacecraft ?? demo.spacecraftFile, networkFile: raw.network ?? demo.networkFile };
      const scenario = loadScenarioNoting(files, io); // throws ScenarioError with every problem
      const p = linkExceedancePercent(scenario.link);
      const climate = renderClimateTable(climateReports(scenario, p), p); // a station the maps cannot serve: ScenarioError naming the file
      // the model-range checks plan runs, for every radio at every station, and plan's warnings
      const deeper = preflight(scenario, scenario.span);
      if (deeper.problems.length > 0) throw new ScenarioError(deeper.problems);
      for (const w of deeper.warnings) io.err(`warning: ${w}\n`);
      const sets = scenario.spacecraft.reduce((n, s) => n + (s.orbit.kind === 'elements' ? s.orbit.sets.length : 0), 0);
      const radios = scenario.spacecraft.reduce((n, s) => n + s.radios.length, 0);
      io.out(
        `ok: ${files.spacecraftFile}: ${scenario.spacecraft.length} spacecraft, ${sets} element sets, ${radios} radios\n` +
          `ok: ${files.networkFile}: ${scenario.stations.length} stations\n\n` +
          climate,
      );
      setExit(0);
    });
}

/** `passbudget climate`: every climate input of each station, its value and where it came from. */
import { Option, type Command } from 'commander';
import { ScenarioError, UsageError, type Problem } from '../errors.js';
import { stationClimate } from '../link/climate/station.js';
import { linkExceedancePercent } from '../plan/link.js';
import { renderClimateJson, renderClimateTable, type StationClimateReport } from '../report/climate.js';
import { demoFiles } from '../scenario/paths.js';
import type { Scenario } from '../scenario/types.js';
import type { CliIo } from './io.js';
import { loadScenarioNoting, withExamples } from './options.js';
import type { SetExit } from './commands.js';

/** Every station's climate at the exceedance; all stations' problems at once (ScenarioError). */
export function climateReports(scenario: Scenario, exceedancePercent: number): StationClimateReport[] {
  const problems: Problem[] = [];
  const out: StationClimateReport[] = [];
  for (const s of scenario.stations) {
    try {
      out.push({ id: s.id, name: s.name, latitudeDeg: s.latitudeDeg, longitudeDeg: s.longitudeDeg, heightKm: s.heightKm, climate: stationClimate(s, exceedancePercent) });
    } catch (err) {
      if (!(err instanceof ScenarioError)) throw err;
      problems.push(...err.problems.map((p) => ({ ...p, file: `${scenario.sources.networkFile}: ${p.file}` })));
    }
  }
  if (problems.length > 0) throw new ScenarioError(problems);
  return out;
}

export function registerClimate(program: Command, io: CliIo, setExit: SetExit): void {
  const cmd = program
    .command('climate')
    .description('every climate input of each station: its value and where it came from (the file, or the ITU-R map and revision)')
    .option('--network <file>', 'ground network file (JSON or YAML) (default: the bundled demo network)')
    .option('--spacecraft <file>', 'spacecraft file whose link availability sets the exceedance (default: the bundled demo fleet)')
    .option('--availability <percent>', "link availability, % (sets the exceedance the maps are read at) (default: the spacecraft file's, else 99.5)")
    .addOption(new Option('--format <format>', 'output format').choices(['table', 'json']).default('table'));
  withExamples(cmd, [
    ['passbudget climate', 'the climate inputs of the demo stations at the demo availability'],
    ['passbudget climate --network net.yaml --availability 99.9', 'your stations, read from the ITU-R maps at 0.1 % exceedance'],
    ['passbudget climate --network net.yaml --format json', 'the same as JSON'],
  ]).action((raw: { network?: string; spacecraft?: string; availability?: string; format: string }) => {
      const demo = demoFiles();
      const scenario = loadScenarioNoting({ spacecraftFile: raw.spacecraft ?? demo.spacecraftFile, networkFile: raw.network ?? demo.networkFile }, io);
      let settings = scenario.link;
      if (raw.availability !== undefined) {
        const a = Number(raw.availability);
        if (!(raw.availability.trim() !== '' && a > 0 && a < 100)) throw new UsageError(`--availability: "${raw.availability}" must be a number in 0..100 (%, exclusive)`);
        settings = { ...settings, availabilityPercent: a };
      }
      const p = linkExceedancePercent(settings);
      const reports = climateReports(scenario, p);
      io.out(raw.format === 'json' ? renderClimateJson(reports, p) : renderClimateTable(reports, p));
      setExit(0);
    });
}

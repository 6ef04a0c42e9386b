/** `passbudget check`: validate scenario files and report every problem at once. */
import { Option, type Command } from 'commander';
import { demoFiles } from '../scenario/paths.js';
import { ScenarioError, type Problem } from '../errors.js';
import { preflight } from '../plan/preflight.js';
import type { CliIo } from './io.js';
import type { SetExit } from './commands.js';
import { climateReports } from './climate.js';
import { linkExceedancePercent } from '../plan/link.js';
import { renderClimateJson, renderClimateTable } from '../report/climate.js';
import { loadScenarioNoting, withExamples } from './options.js';
import { loadScenario } from '../scenario/load.js';
import type { Scenario } from '../scenario/types.js';

interface CheckResult {
  scenario: Scenario;
  warnings: string[];
  climateTable: string;
  climateJson: unknown;
}

/** Every check plan runs before its work; throws ScenarioError with every problem. */
function checkAll(scenario: Scenario): CheckResult {
  const p = linkExceedancePercent(scenario.link);
  const reports = climateReports(scenario, p); // a station the maps cannot serve: ScenarioError naming the file
  // the model-range checks plan runs, for every radio at every station, and plan's warnings
  const deeper = preflight(scenario, scenario.span);
  if (deeper.problems.length > 0) throw new ScenarioError(deeper.problems);
  return { scenario, warnings: deeper.warnings, climateTable: renderClimateTable(reports, p), climateJson: JSON.parse(renderClimateJson(reports, p)) };
}

function counts(scenario: Scenario): { spacecraft: number; element_sets: number; radios: number; stations: number } {
  return {
    spacecraft: scenario.spacecraft.length,
    element_sets: scenario.spacecraft.reduce((n, s) => n + (s.orbit.kind === 'elements' ? s.orbit.sets.length : 0), 0),
    radios: scenario.spacecraft.reduce((n, s) => n + s.radios.length, 0),
    stations: scenario.stations.length,
  };
}

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

const problemJson = (p: Problem) => ({ file: p.file, field: p.path, message: p.message });

export function registerCheck(program: Command, io: CliIo, setExit: SetExit): void {
  const cmd = program
    .command('check')
    .description('validate spacecraft and network files; print every problem, one per line (exit 2 if any)')
    .option('--spacecraft <file>', 'spacecraft file (JSON or YAML) (default: the bundled demo fleet)')
    .option('--network <file>', 'ground network file (JSON or YAML) (default: the bundled demo network)')
    .addOption(new Option('--format <format>', 'output format (json: one document on stdout, problems included)').choices(['table', 'json']).default('table'));
  withExamples(cmd, [
    ['passbudget check --spacecraft examples/broken-fleet.json --network examples/broken-network.json', 'the shipped broken example: every problem, one line each, exit 2'],
    ['passbudget check --spacecraft examples/cubesat.yaml --network examples/one-dish.yaml', 'a valid pair: ok lines, notes on defaults, each station\'s climate inputs'],
    ['passbudget check --spacecraft fleet.yaml --network net.yaml --format json', 'the result as one JSON document (for an editor or a CI job)'],
  ]).action((raw: { spacecraft?: string; network?: string; format: 'table' | 'json' }) => {
    const demo = demoFiles();
    const files = { spacecraftFile: raw.spacecraft ?? demo.spacecraftFile, networkFile: raw.network ?? demo.networkFile };
    if (raw.format === 'json') {
      let doc: Record<string, unknown>;
      let code = 0;
      let scenario: Scenario | undefined;
      try {
        scenario = loadScenario(files);
        const r = checkAll(scenario);
        doc = { ok: true, ...counts(scenario), problems: [], warnings: r.warnings, notices: scenario.notices, climate: r.climateJson };
      } catch (err) {
        if (!(err instanceof ScenarioError)) throw err;
        code = 2;
        doc = { ok: false, problems: err.problems.map(problemJson), warnings: [], notices: scenario?.notices ?? [] };
      }
      io.out(JSON.stringify({ spacecraft_file: files.spacecraftFile, network_file: files.networkFile, ...doc }, null, 2) + '\n');
      setExit(code);
      return;
    }
    const scenario = loadScenarioNoting(files, io); // throws ScenarioError with every problem
    const r = checkAll(scenario);
    for (const w of r.warnings) io.err(`warning: ${w}\n`);
    const c = counts(scenario);
    io.out(
      `ok: ${files.spacecraftFile}: ${c.spacecraft} spacecraft, ${plural(c.element_sets, 'element set')}, ${plural(c.radios, 'radio')}\n` +
        `ok: ${files.networkFile}: ${plural(c.stations, 'station')}\n\n` +
        r.climateTable,
    );
    setExit(0);
  });
}

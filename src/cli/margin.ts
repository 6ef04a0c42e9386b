/**
 * `passbudget margin`: the worst-case elevation check per station and spacecraft
 * (src/plan/margin.ts for the rules). Prints a table / JSON / CSV (--format), writes
 * <out>/margin.csv and <out>/margin.json, and exits 1 when any row fails.
 */
import type { Command } from 'commander';
import { assertPreflight, withNamedProblems } from '../plan/preflight.js';
import { runPlanParallel } from '../plan/parallel.js';
import { marginGatePasses, marginRows } from '../plan/margin.js';
import { renderMarginCsv, renderMarginJson, renderMarginTable, type MarginReport } from '../report/margin.js';
import { writeOutputs } from '../report/write.js';
import { addCommonOptions, prepareOutput, readCommonOptions, spanFor, withAvailability, loadScenarioNoting, withExamples } from './options.js';
import { DEFAULT_LINK_STEP_S } from '../plan/link.js';
import type { CliIo } from './io.js';
import type { SetExit } from './commands.js';

export function registerMargin(program: Command, io: CliIo, setExit: SetExit): void {
  withExamples(
    addCommonOptions(
      program
        .command('margin')
        .description('worst-case elevation margin per station and spacecraft, the usable data mask, and the worst margin seen; exit 1 on a failure'),
      { formats: ['table', 'json', 'csv'], step: `link sampling step inside contacts for the worst margin seen, e.g. 10s (default: ${DEFAULT_LINK_STEP_S}s)` },
    ),
    [
      ['passbudget margin', 'the demo: one row per station and spacecraft, PASS or FAIL, margin.json and margin.csv under out/'],
      ['passbudget margin --spacecraft fleet.yaml --network net.yaml --no-write || echo "a link fails"', 'gate a design review or a CI job on the exit code (1 on a failure)'],
      ['passbudget margin --format json --no-write', 'the same rows as JSON on stdout'],
    ],
  ).action(async (raw) => {
    const opts = readCommonOptions(raw);
    prepareOutput(opts, io, ['margin.json', 'margin.csv']);
    const scenario = withAvailability(loadScenarioNoting(opts.files, io), opts.availabilityPercent);
    const span = spanFor(opts, scenario, io);
    assertPreflight(scenario, span); // file and field of a model-range problem, before any work
    const plan = await withNamedProblems(scenario, span, () => runPlanParallel(scenario, span, opts.stepS !== undefined ? { linkStepS: opts.stepS } : {}));
    const report: MarginReport = { span, availabilityPercent: scenario.link.availabilityPercent, rows: marginRows(scenario, plan) };
    const json = renderMarginJson(report);
    const csv = renderMarginCsv(report);
    if (opts.format === 'json') io.out(json);
    else if (opts.format === 'csv') io.out(csv);
    else io.out(renderMarginTable(report));
    for (const w of plan.warnings) io.err(`warning: ${w}\n`);
    if (opts.write) {
      const written = await writeOutputs(opts.outDir, [
        { name: 'margin.json', content: json },
        { name: 'margin.csv', content: csv },
      ]);
      if (opts.format === 'table') io.out(`\nwrote ${written.join(', ')}\n`);
    }
    // 1: a requirement failed (main.ts EXIT_REQUIREMENT_FAILED); 0: ok
    // 'not visible' rows (no contact in the span) neither pass nor fail
    setExit(marginGatePasses(report.rows) ? 0 : 1);
  });
}

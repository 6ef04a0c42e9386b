/** `passbudget plan`: contact windows, volume per contact, report files under --out. */
import type { Command } from 'commander';
import { loadScenario } from '../scenario/load.js';
import { runPlan } from '../plan/run.js';
import { renderPlanTable, renderPlanJson, renderPlanCsv } from '../report/plan.js';
import { writeOutputs } from '../report/write.js';
import { addCommonOptions, readCommonOptions, spanFor } from './options.js';
import type { CliIo } from './io.js';
import type { SetExit } from './commands.js';

export function registerPlan(program: Command, io: CliIo, setExit: SetExit): void {
  addCommonOptions(
    program.command('plan').description('contact windows of every spacecraft over every station, with the data volume of each contact'),
  ).action((raw) => {
    const opts = readCommonOptions(raw);
    const scenario = loadScenario(opts.files);
    const span = spanFor(opts, scenario, io.nowMs());
    const plan = runPlan(scenario, span, opts.stepS !== undefined ? { linkStepS: opts.stepS } : {});
    const json = renderPlanJson(plan);
    const csv = renderPlanCsv(plan);
    if (opts.format === 'json') io.out(json);
    else if (opts.format === 'csv') io.out(csv);
    else io.out(renderPlanTable(plan, opts.zone));
    for (const w of plan.warnings) io.err(`warning: ${w}\n`);
    if (opts.write) {
      const written = writeOutputs(opts.outDir, [
        { name: 'plan.json', content: json },
        { name: 'contacts.csv', content: csv },
      ]);
      if (opts.format === 'table') io.out(`\nwrote ${written.join(', ')}\n`);
    }
    setExit(0);
  });
}

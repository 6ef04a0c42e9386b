// Worker threads give exactly the single-thread plan: same contacts in the same order,
// same volumes to the bit, same warnings. Workers need the compiled program, so this
// test drives dist/ (npm test builds it first). Scenario: the demo network with
// 12 invented LEO spacecraft from the benchmark's generator plus the demo fleet.
import { describe, it, expect } from 'vitest';
import { existsSync } from 'node:fs';
import { join, dirname } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { loadScenario } from '../../src/scenario/load.js';
import { demoFiles } from '../../src/scenario/paths.js';
import { runPlan } from '../../src/plan/run.js';
import type { Scenario } from '../../src/scenario/types.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const distParallel = join(root, 'dist', 'src', 'plan', 'parallel.js');

describe('runPlanParallel', () => {
  it('equals runPlan on 18 spacecraft over one day', async () => {
    if (!existsSync(distParallel)) throw new Error('build first: npm run build');
    const { runPlanParallel, threadsFor } = (await import(pathToFileURL(distParallel).href)) as typeof import('../../src/plan/parallel.js');
    const { syntheticScenario } = (await import(pathToFileURL(join(root, 'dist', 'bench', 'link-bench.js')).href)) as typeof import('../../bench/link-bench.js');
    const demo = loadScenario(demoFiles());
    const span = { startMs: demo.span!.startMs, endMs: demo.span!.startMs + 86_400_000 };
    const extra = syntheticScenario(12, 1, span).spacecraft;
    const scenario: Scenario = { ...demo, spacecraft: [...demo.spacecraft, ...extra] };
    expect(threadsFor(scenario.spacecraft.length, 2)).toBe(2);
    const serial = runPlan(scenario, span);
    const parallel = await runPlanParallel(scenario, span, {}, 2);
    expect(parallel.contacts.length).toBe(serial.contacts.length);
    expect(JSON.stringify(parallel)).toBe(JSON.stringify(serial));
  });
});

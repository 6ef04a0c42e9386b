// --availability on plan, trace, margin, budget and size: the flag replaces the spacecraft
// file's link.availabilityPercent (the exceedance p = 100 - availability the ITU-R P.618-14
// statistics are taken at); outside 90..99.999 it is one line naming the flag, exit 2.
// Independent check: the rain term at p = 0.1 % exceeds the one at 0.5 % (P.618-14 §2.2.1.1
// step 10: Ap falls with p), and the budget's header and the plan's header name the figure.
import { describe, it, expect } from 'vitest';
import { run } from '../../src/cli/main.js';

async function cli(args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const code = await run(args, { out: (t) => (out += t), err: (t) => (err += t), isTty: false, nowMs: () => 0 });
  return { code, out, err };
}

const rainDb = (json: string): number => (JSON.parse(json) as { terms: { name: string; value: number }[] }).terms.find((t) => t.name === 'Rain attenuation')!.value;

describe('--availability', () => {
  it('budget: the rain term at 99.9 % is deeper than at the file\'s 99.5 %', async () => {
    const base = ['budget', '--spacecraft-id', 'ANCHOR-G', '--station-id', 'EQP', '--elevation', '20', '--format', 'json'];
    const a = await cli(base);
    const b = await cli([...base, '--availability', '99.9']);
    expect(a.code).toBe(0);
    expect(b.code).toBe(0);
    expect(rainDb(b.out)).toBeLessThan(rainDb(a.out) - 1); // terms are losses, negative
  });

  it('plan names the availability it used', async () => {
    const r = await cli(['plan', '--days', '0.1', '--availability', '99.9', '--no-write']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/link at 99\.9 % availability/);
  });

  const extra: Record<string, string[]> = {
    plan: ['--no-write'],
    trace: ['--no-write'],
    margin: ['--no-write'],
    size: ['--spacecraft-id', 'KESTREL-1', '--target-gbit-per-day', '100', '--no-write'],
    budget: ['--spacecraft-id', 'KESTREL-1', '--station-id', 'FRV', '--elevation', '10'],
  };
  for (const [cmd, more] of Object.entries(extra)) {
    it(`${cmd}: a value outside 90..99.999 is one line, exit 2`, async () => {
      const r = await cli([cmd, '--availability', '80', ...more]);
      expect(r.code).toBe(2);
      expect(r.out).toBe('');
      expect(r.err.trim().split('\n')).toHaveLength(1);
      expect(r.err).toMatch(/--availability: "80" must be a percentage in 90\.\.99\.999/);
    });
  }
});

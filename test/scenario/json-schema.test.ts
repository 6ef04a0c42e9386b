// The JSON Schema that `passbudget schema` prints, checked with an independent validator
// (ajv 8.20.0, JSON Schema draft 2020-12): every shipped scenario file validates against
// the schema of its kind (and the combined one), the deliberately broken examples do not,
// for the reasons the README's check example names.
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { parse as parseYaml } from 'yaml';
import { run } from '../../src/cli/main.js';

const repoRoot = join(dirname(fileURLToPath(import.meta.url)), '..', '..');

async function schemaFromCli(args: string[]): Promise<object> {
  let out = '';
  const code = await run(['schema', ...args], { out: (t) => (out += t), err: () => {}, isTty: false, nowMs: () => 0 });
  expect(code).toBe(0);
  return JSON.parse(out) as object;
}

/** Every scenario file shipped: the demo, the examples; kind from its top-level list. */
function shippedFiles(): { path: string; data: Record<string, unknown> }[] {
  const paths = [
    ...readdirSync(join(repoRoot, 'ephemerides')).filter((f) => /\.(json|ya?ml)$/.test(f)).map((f) => `ephemerides/${f}`),
    ...readdirSync(join(repoRoot, 'stations')).filter((f) => /\.(json|ya?ml)$/.test(f)).map((f) => `stations/${f}`),
    ...readdirSync(join(repoRoot, 'examples')).filter((f) => /\.(json|ya?ml)$/.test(f)).map((f) => `examples/${f}`),
  ];
  return paths.map((p) => {
    const text = readFileSync(join(repoRoot, p), 'utf8');
    return { path: p, data: (p.endsWith('.json') ? JSON.parse(text) : parseYaml(text)) as Record<string, unknown> };
  });
}

describe('passbudget schema against ajv', () => {
  it('validates every shipped scenario file and rejects the broken examples', async () => {
    const ajv = new Ajv2020({ allErrors: true, strict: false });
    const validate = {
      spacecraft: ajv.compile(await schemaFromCli(['spacecraft'])),
      network: ajv.compile(await schemaFromCli(['network'])),
      booking: ajv.compile(await schemaFromCli(['booking'])),
      either: ajv.compile(await schemaFromCli([])),
    };
    const files = shippedFiles();
    expect(files.length).toBeGreaterThanOrEqual(6);
    for (const f of files) {
      const kind = 'booking' in f.data ? 'booking' : 'spacecraft' in f.data ? 'spacecraft' : 'network';
      const ok = validate[kind](f.data);
      const either = validate.either(f.data);
      if (f.path.includes('broken')) {
        expect(ok, f.path).toBe(false);
        expect(either, f.path).toBe(false);
      } else {
        expect(ok, `${f.path}: ${JSON.stringify(validate[kind].errors)}`).toBe(true);
        expect(either, f.path).toBe(true);
      }
    }
    // the reasons: a power written as text, a latitude beyond the pole
    validate.spacecraft(files.find((f) => f.path === 'examples/broken-fleet.json')!.data);
    expect(validate.spacecraft.errors?.map((e) => `${e.instancePath} ${e.keyword}`)).toContain('/spacecraft/0/radios/0/powerW type');
    validate.network(files.find((f) => f.path === 'examples/broken-network.json')!.data);
    expect(validate.network.errors?.map((e) => `${e.instancePath} ${e.keyword}`)).toContain('/stations/0/latitudeDeg minimum');
  });

  it('an unknown kind is one line and exit 2', async () => {
    let err = '';
    const code = await run(['schema', 'satellites'], { out: () => {}, err: (t) => (err += t), isTty: false, nowMs: () => 0 });
    expect(code).toBe(2);
    expect(err).toBe('error: schema: "satellites" is not a file kind; valid: spacecraft, network, booking\n');
  });
});

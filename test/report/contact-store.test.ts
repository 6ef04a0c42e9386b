// Spilled contact texts (src/report/batch-text.ts, src/report/contact-store.ts) read back
// through 32 KiB windows give exactly the bytes rendered in memory, in the orders the
// outputs ask for them: plan order (CSV, JSON, JSON Lines), by AOS across stations
// (contacts.ics) and station by station (the station calendars); and the texts are the
// per-contact renderers' own (contactTexts, eventText). Scenario: the bundled demo, one day,
// one station renamed with letters beyond ASCII.
import { describe, it, expect } from 'vitest';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadScenario } from '../../src/scenario/load.js';
import { demoFiles } from '../../src/scenario/paths.js';
import { runPlan } from '../../src/plan/run.js';
import { renderBatchTexts } from '../../src/report/batch-text.js';
import { attachContactTexts, contactTextsOf, FORM, releaseContactTexts, storedText, type Form } from '../../src/report/contact-store.js';
import { contactTexts, csvLayout } from '../../src/report/contact-text.js';
import { contactUids, eventContext, eventText } from '../../src/report/calendar.js';

describe('spilled contact texts', () => {
  it('read back byte for byte in every order the outputs use', () => {
    const scenario = loadScenario(demoFiles());
    const start = scenario.span!.startMs;
    const found = runPlan(scenario, { startMs: start, endMs: start + 86_400_000 }, { linkStepS: 30 });
    // names beyond ASCII (in the calendar events): byte offsets are not character offsets
    const plan = { ...found, stations: found.stations.map((s, i) => (i === 0 ? { ...s, name: `Søndre Ørn ✓ ${s.name}` } : s)) };
    const n = plan.contacts.length;
    expect(n).toBeGreaterThan(50);
    const dir = mkdtempSync(join(tmpdir(), 'pb-spill-'));
    try {
      const inMemory = renderBatchTexts(plan);
      const spilled = renderBatchTexts(plan, join(dir, 'batch-0.bin'));
      expect(spilled.forms.every((f) => f.bytes === undefined)).toBe(true);
      const stationIndex = new Map(plan.stations.map((s, i) => [s.id, i]));
      const source = new Uint32Array(2 * n);
      const station = new Uint32Array(n);
      plan.contacts.forEach((c, i) => {
        source[2 * i] = 0;
        source[2 * i + 1] = i;
        station[i] = stationIndex.get(c.stationId)!;
      });
      const copy = { ...plan };
      attachContactTexts(copy, { batches: [spilled], source, station, stations: plan.stations.length });
      const store = contactTextsOf(copy)!;
      const layout = csvLayout(plan.contacts);
      const uids = contactUids(plan);
      const ctx = eventContext(plan);
      const expected = (form: Form, i: number): string => {
        if (form === FORM.ics) return eventText(ctx, plan.contacts[i]!, uids[i]!);
        const t = contactTexts(plan.contacts[i]!, layout);
        return form === FORM.csv ? t.csv : form === FORM.json ? t.json : t.line;
      };
      const planOrder = plan.contacts.map((_, i) => i);
      const byAos = [...planOrder].sort((a, b) => plan.contacts[a]!.aosMs - plan.contacts[b]!.aosMs || a - b);
      for (const form of [FORM.csv, FORM.json, FORM.line, FORM.ics] as Form[]) {
        const orders = form === FORM.ics ? [byAos, ...plan.stations.map((_, s) => byAos.filter((i) => station[i] === s))] : [planOrder];
        for (const order of orders) {
          for (const i of order) {
            const got = Buffer.from(storedText(store, form, i)!).toString('utf8');
            const f = inMemory.forms[form]!;
            expect(got).toBe(Buffer.from(f.bytes!.subarray(f.offsets[i]!, f.offsets[i + 1]!)).toString('utf8'));
            expect(got).toBe(expected(form, i));
          }
        }
      }
      releaseContactTexts(copy);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

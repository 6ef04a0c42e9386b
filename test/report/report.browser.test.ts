// The HTML report opened in a real browser (Debian's chromium through playwright-core):
// the page loads offline from file:// with no other request; the station-day view has one
// row per station and day; the contact list one row per contact of plan.json (the run's own
// JSON, a separate renderer of the same plan: the page drops or doubles nothing); every
// sky-plot point lies inside its plot; the daily totals match plan.json; the page fits a
// 1280 px window and stays under 5 MB, also for a generated large fleet (160 invented LEO
// spacecraft x 12 invented stations for a day), where the list says it shows aggregates.
// Skipped, with a message, only when /usr/bin/chromium is missing outside CI.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { run } from '../../src/cli/main.js';
import { formatBits } from '../../src/report/table.js';
import { CONTACT_DETAIL_LIMIT, TOP_CONTACTS } from '../../src/report/html/bounds.js';

const CHROMIUM = '/usr/bin/chromium';
const haveChromium = existsSync(CHROMIUM);
const inCi = Boolean(process.env.CI);
const skip = !haveChromium && !inCi;
if (skip) console.warn(`report.browser.test: skipped: ${CHROMIUM} is not installed (apt-get install -y chromium); CI runs it.`);

const repoRoot = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const screenshotPath = join(repoRoot, 'out', 'report-screenshot.png');
const FIVE_MB = 5 * 1024 * 1024;

interface PlanJson {
  stations: { id: string }[];
  contacts: { station: string; spacecraft: string; volume_bits?: number }[];
  daily: { station: string; day: string; volume_bits: number; contacts: number }[];
}

async function plan(args: string[]): Promise<{ outDir: string; plan: PlanJson }> {
  const outDir = mkdtempSync(join(tmpdir(), 'pb-report-'));
  let err = '';
  const code = await run(['plan', ...args, '--out', outDir, '--format', 'json'], { out: () => {}, err: (t) => (err += t), isTty: false, nowMs: () => 0 });
  expect(code, err).toBe(0);
  return { outDir, plan: JSON.parse(readFileSync(join(outDir, 'plan.json'), 'utf8')) as PlanJson };
}

async function open(context: BrowserContext, file: string, outside: string[]): Promise<Page> {
  const page = await context.newPage();
  page.on('request', (r) => {
    if (!r.url().startsWith('file:')) outside.push(r.url());
  });
  await page.goto(pathToFileURL(file).href, { waitUntil: 'load' });
  return page;
}

/** An invented large fleet: planned orbits spread over altitude, inclination and node; invented stations. */
function writeLargeFleet(dir: string, spacecraft: number, stations: number): { fleet: string; network: string } {
  const fleet = {
    window: { from: '2026-03-05T00:00:00Z', days: 1 },
    link: { acquisitionTimeS: 10 },
    spacecraft: Array.from({ length: spacecraft }, (_, i) => ({
      id: `INV-${String(i + 1).padStart(3, '0')}`,
      orbit: {
        planned: {
          altitudeKm: 450 + ((i * 37) % 400),
          ...(i % 3 === 0 ? { sunSynchronous: true, ltan: `${String(6 + (i % 12)).padStart(2, '0')}:00` } : { inclinationDeg: 40 + ((i * 13) % 60), raanDeg: (i * 47) % 360 }),
          meanAnomalyDeg: (i * 71) % 360,
          epoch: '2026-03-05T00:00:00Z',
        },
      },
      radios: [{ id: 'X', frequencyMHz: 8100 + (i % 20) * 10, powerW: 2, antenna: { gainDbi: 6 }, coding: { adaptive: true, table: 'DVB-S2', symbolRateBaud: 5e6 } }],
    })),
  };
  const network = {
    stations: Array.from({ length: stations }, (_, k) => ({
      id: `GS${k + 1}`,
      latitudeDeg: -70 + ((k * 29) % 140),
      longitudeDeg: -170 + k * 31,
      maskDeg: 5,
      antenna: { dishDiameterM: 3.7 },
      receiver: { noiseTempK: 90 },
      climate: { rainRate001MmH: 30, rainHeightKm: 3, waterVapourDensityGM3: 7.5, temperatureK: 288, pressureHpa: 1013, nWetMedian: 40, cloudLiquidWaterKgM2: 0 },
    })),
  };
  const f = join(dir, 'large-fleet.json');
  const n = join(dir, 'large-network.json');
  writeFileSync(f, JSON.stringify(fleet));
  writeFileSync(n, JSON.stringify(network));
  return { fleet: f, network: n };
}

describe.skipIf(skip)('report.html in a browser', () => {
  let outDir: string;
  let demo: PlanJson;
  let context: BrowserContext;
  let page: Page;
  const outsideRequests: string[] = [];

  beforeAll(async () => {
    ({ outDir, plan: demo } = await plan(['--days', '1', '--step', '10s']));
    context = await chromium.launchPersistentContext(mkdtempSync(join(tmpdir(), 'pb-chromium-')), {
      executablePath: CHROMIUM,
      viewport: { width: 1280, height: 900 },
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    });
    page = await open(context, join(outDir, 'report.html'), outsideRequests);
  }, 120_000);

  afterAll(async () => {
    await context?.close();
  });

  it('is self-contained and bounded: no request beyond the file, < 5 MB', () => {
    expect(outsideRequests).toEqual([]);
    expect(statSync(join(outDir, 'report.html')).size).toBeLessThan(FIVE_MB);
  });

  it('station-day view: one row per station and day, one track per contact of plan.json', async () => {
    const rows = await page.$$eval('#station-days .sd-row[data-day]', (els) => els.map((e) => `${e.getAttribute('data-station')}|${e.getAttribute('data-day')}`));
    const days = 1;
    expect(rows.length).toBe(demo.stations.length * days);
    expect(new Set(rows).size).toBe(rows.length);
    const tracks = await page.$$eval('.sd-contact', (els) =>
      els.map((e) => ({ key: `${e.getAttribute('data-station')}|${e.getAttribute('data-spacecraft')}|${e.getAttribute('data-volume-bits')}`, width: e.getBoundingClientRect().width })),
    );
    expect(demo.contacts.length).toBeGreaterThan(50);
    const fromJson = demo.contacts.map((c) => `${c.station}|${c.spacecraft}|${c.volume_bits ?? 0}`).sort();
    expect(tracks.map((t) => t.key).sort()).toEqual(fromJson);
    for (const t of tracks) expect(t.width).toBeGreaterThan(0);
  });

  it('contact list: one row per contact of plan.json, grouped per station and day', async () => {
    const rows = await page.$$eval('#contact-list .contact-row', (els) =>
      els.map((e) => `${e.getAttribute('data-station')}|${e.getAttribute('data-spacecraft')}|${e.getAttribute('data-volume-bits')}`),
    );
    expect(rows.sort()).toEqual(demo.contacts.map((c) => `${c.station}|${c.spacecraft}|${c.volume_bits ?? 0}`).sort());
    const groups = await page.$$eval('#contact-list tbody.group', (els) => els.length);
    expect(groups).toBe(new Set(demo.contacts.map((c) => c.station)).size); // one day: one group per station with contacts
  });

  it('passes that matter: every sky-plot point inside its plot circle', async () => {
    const plots = await page.$$eval('svg.sky', (svgs) =>
      svgs.map((svg) => {
        const rim = svg.querySelector('.sky-rim')!.getBoundingClientRect();
        const cx = rim.x + rim.width / 2;
        const cy = rim.y + rim.height / 2;
        const r = rim.width / 2;
        return Array.from(svg.querySelectorAll('.sky-pt')).map((p) => {
          const b = p.getBoundingClientRect();
          return Math.hypot(b.x + b.width / 2 - cx, b.y + b.height / 2 - cy) / r;
        });
      }),
    );
    expect(plots.length).toBeGreaterThanOrEqual(1);
    expect(plots.length).toBeLessThanOrEqual(3);
    for (const pts of plots) {
      expect(pts.length).toBeGreaterThan(10);
      for (const d of pts) expect(d).toBeLessThanOrEqual(1.0001);
    }
  });

  it('shows the daily totals of plan.json: one bar and one table cell per daily row, same bits', async () => {
    const fromJson = demo.daily.map((r) => `${r.station}|${r.day}|${r.volume_bits}`).sort();
    const barKeys = await page.$$eval('.day-bar', (els) =>
      els.map((e) => `${e.getAttribute('data-station')}|${e.getAttribute('data-day')}|${e.getAttribute('data-volume-bits')}`),
    );
    expect(barKeys.sort()).toEqual(fromJson);
    const cells = await page.$$eval('.day-cell', (els) =>
      els.map((e) => ({ key: `${e.getAttribute('data-station')}|${e.getAttribute('data-day')}|${e.getAttribute('data-volume-bits')}`, text: e.textContent ?? '' })),
    );
    expect(cells.map((c) => c.key).sort()).toEqual(fromJson);
    for (const r of demo.daily) {
      const cell = cells.find((c) => c.key === `${r.station}|${r.day}|${r.volume_bits}`);
      expect(cell?.text).toContain(`${formatBits(r.volume_bits)} (${r.contacts})`);
    }
  });

  it('provenance: both input files with their SHA-256 as on disk', async () => {
    const text = await page.$eval('#provenance', (e) => e.textContent ?? '');
    const { createHash } = await import('node:crypto');
    for (const f of ['ephemerides/demo-fleet.json', 'stations/demo-network.yaml', 'ephemerides/demo-fleet.tle']) {
      expect(text).toContain(createHash('sha256').update(readFileSync(join(repoRoot, f))).digest('hex'));
    }
  });

  it('fits a 1280 px window and labels its charts; saves a screenshot', async () => {
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    const svgTitles = await page.$$eval('svg', (els) => els.map((e) => e.querySelector(':scope > title')?.textContent ?? ''));
    expect(svgTitles.length).toBeGreaterThan(3);
    for (const t of svgTitles) expect(t.length).toBeGreaterThan(10);
    mkdirSync(dirname(screenshotPath), { recursive: true });
    await page.screenshot({ path: screenshotPath, fullPage: true });
    expect(statSync(screenshotPath).size).toBeGreaterThan(10_000);
  });

  it('a large fleet (160 spacecraft x 12 stations, one day): under 5 MB, aggregates and the top contacts, said so', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'pb-large-'));
    const { fleet, network } = writeLargeFleet(dir, 160, 12);
    const big = await plan(['--spacecraft', fleet, '--network', network]);
    expect(big.plan.contacts.length).toBeGreaterThan(CONTACT_DETAIL_LIMIT);
    const file = join(big.outDir, 'report.html');
    const bytes = statSync(file).size;
    console.log(`large fleet: ${big.plan.contacts.length} contacts, report.html ${(bytes / 1e6).toFixed(2)} MB`);
    expect(bytes).toBeLessThan(FIVE_MB);
    const outside: string[] = [];
    const p = await open(context, file, outside);
    expect(outside).toEqual([]);
    expect(await p.$$eval('#station-days .sd-row[data-day]', (els) => els.length)).toBe(12);
    expect(await p.$$eval('#contact-list .agg-row', (els) => els.length)).toBe(12);
    expect(await p.$$eval('#contact-list .contact-row', (els) => els.length)).toBe(TOP_CONTACTS);
    const note = await p.$eval('#contact-list p.bound', (e) => e.textContent ?? '');
    expect(note).toContain(`${big.plan.contacts.length} contacts`);
    expect(note).toContain('not every contact');
    await p.close();
  }, 240_000);
});

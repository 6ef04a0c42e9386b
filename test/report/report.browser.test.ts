// The HTML report opened in a real browser (Debian's chromium through
// playwright-core): the page loads offline from file:// with no other request,
// shows one .contact-bar per contact of plan.json and one .day-bar per daily
// row of plan.json with the same bits, and fits a 1280 px wide window.
// The reference for the counts is the run's own plan.json (a separate renderer
// of the same plan); the check is that the page drops or doubles nothing.
// Skipped, with a message, only when /usr/bin/chromium is missing outside CI.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { run } from '../../src/cli/main.js';
import { formatBits } from '../../src/report/table.js';

const CHROMIUM = '/usr/bin/chromium';
const haveChromium = existsSync(CHROMIUM);
const inCi = Boolean(process.env.CI);
const skip = !haveChromium && !inCi;
if (skip) console.warn(`report.browser.test: skipped: ${CHROMIUM} is not installed (apt-get install -y chromium); CI runs it.`);

const repoRoot = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const screenshotPath = join(repoRoot, 'out', 'report-screenshot.png');
const TWO_MB = 2 * 1024 * 1024;

interface PlanJson {
  contacts: { station: string; spacecraft: string; volume_bits?: number }[];
  daily: { station: string; day: string; volume_bits: number; contacts: number }[];
}

describe.skipIf(skip)('report.html in a browser', () => {
  let outDir: string;
  let plan: PlanJson;
  let context: BrowserContext;
  let page: Page;
  const outsideRequests: string[] = [];

  beforeAll(async () => {
    outDir = mkdtempSync(join(tmpdir(), 'pb-report-'));
    let err = '';
    const code = await run(['plan', '--days', '1', '--step', '10s', '--out', outDir, '--format', 'json'], {
      out: () => {},
      err: (t) => (err += t),
      isTty: false,
      nowMs: () => 0,
    });
    expect(code, err).toBe(0);
    plan = JSON.parse(readFileSync(join(outDir, 'plan.json'), 'utf8')) as PlanJson;
    context = await chromium.launchPersistentContext(mkdtempSync(join(tmpdir(), 'pb-chromium-')), {
      executablePath: CHROMIUM,
      viewport: { width: 1280, height: 900 },
      args: [
        '--headless',
        '--no-sandbox',
        '--disable-gpu',
        '--disable-quic',
        '--no-first-run',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
      ],
    });
    page = await context.newPage();
    page.on('request', (r) => {
      if (!r.url().startsWith('file:')) outsideRequests.push(r.url());
    });
    await page.goto(pathToFileURL(join(outDir, 'report.html')).href, { waitUntil: 'load' });
  });

  afterAll(async () => {
    await context?.close();
  });

  it('is self-contained and small: no request beyond the file, < 2 MB', () => {
    expect(outsideRequests).toEqual([]);
    expect(statSync(join(outDir, 'report.html')).size).toBeLessThan(TWO_MB);
  });

  it('draws one contact bar per contact of plan.json, with its station, spacecraft and volume', async () => {
    expect(plan.contacts.length).toBeGreaterThan(50);
    const bars = await page.$$eval('.contact-bar', (els) =>
      els.map((e) => ({
        station: e.getAttribute('data-station'),
        spacecraft: e.getAttribute('data-spacecraft'),
        bits: Number(e.getAttribute('data-volume-bits')),
        title: e.querySelector('title')?.textContent ?? '',
        width: e.getBoundingClientRect().width,
      })),
    );
    expect(bars.length).toBe(plan.contacts.length);
    const key = (s: string | null, sc: string | null, b: number) => `${s}|${sc}|${b}`;
    const fromPage = bars.map((b) => key(b.station, b.spacecraft, b.bits)).sort();
    const fromJson = plan.contacts.map((c) => key(c.station, c.spacecraft, c.volume_bits ?? 0)).sort();
    expect(fromPage).toEqual(fromJson);
    for (const b of bars) {
      expect(b.title).toContain(b.spacecraft ?? '-');
      expect(b.width).toBeGreaterThan(0);
    }
  });

  it('shows the daily totals of plan.json: one bar and one table cell per daily row, same bits', async () => {
    const fromJson = plan.daily.map((r) => `${r.station}|${r.day}|${r.volume_bits}`).sort();
    const barKeys = await page.$$eval('.day-bar', (els) =>
      els.map((e) => `${e.getAttribute('data-station')}|${e.getAttribute('data-day')}|${e.getAttribute('data-volume-bits')}`),
    );
    expect(barKeys.sort()).toEqual(fromJson);
    const cells = await page.$$eval('.day-cell', (els) =>
      els.map((e) => ({ key: `${e.getAttribute('data-station')}|${e.getAttribute('data-day')}|${e.getAttribute('data-volume-bits')}`, text: e.textContent ?? '' })),
    );
    expect(cells.map((c) => c.key).sort()).toEqual(fromJson);
    // the figure a reader sees is the row's volume and contact count
    for (const r of plan.daily) {
      const cell = cells.find((c) => c.key === `${r.station}|${r.day}|${r.volume_bits}`);
      expect(cell?.text).toContain(`${formatBits(r.volume_bits)} (${r.contacts})`);
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
});

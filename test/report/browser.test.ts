/**
 * Opens the demo report in a real browser (Debian's chromium, headless, networking disabled) and
 * checks that it renders: every chart has marks with a nonzero bounding box, the console stays
 * free of errors, and the page requests nothing but file: and data: URLs.
 *
 * Skips only outside CI when /usr/bin/chromium is missing; with CI=true a missing browser fails
 * (scripts/ci-install-browser.sh installs it).
 */
import { cpSync, existsSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { writeReport } from '../../src/io/write-report.js';
import { defaultStudyStages } from '../../src/io/study-stages.js';
import { runStudy } from '../../src/pipeline.js';

const CHROMIUM = '/usr/bin/chromium';
const inCi = process.env.CI === 'true' || process.env.CI === '1';
const haveBrowser = existsSync(CHROMIUM);
const root = resolve(__dirname, '../..');

if (inCi && !haveBrowser) {
  describe('HTML report in a real browser', () => {
    it('needs Debian chromium at /usr/bin/chromium under CI', () => {
      throw new Error(`CI=true but ${CHROMIUM} is missing: run scripts/ci-install-browser.sh (apt-get install chromium) before the tests.`);
    });
  });
} else {
  describe.skipIf(!haveBrowser)('HTML report of the demo study in a real browser (chromium, headless, no network)', () => {
    const work = mkdtempSync(join(tmpdir(), 'lexichron-browser-'));
    let context: BrowserContext;
    let reportPath = '';
    const consoleErrors: string[] = [];
    const requests: string[] = [];
    let marks: { chart: string; marks: number }[] = [];
    let clipped: string[] = [];
    let screenshot = '';
    let ratingsRows: string[][] = [];
    let pageText = '';
    let preBlocks = 0;

    beforeAll(async () => {
      // the demo study, run end to end into a temporary folder
      const demo = join(work, 'demo-data');
      cpSync(join(root, 'demo-data'), demo, { recursive: true });
      const study = JSON.parse(readFileSync(join(demo, 'study.json'), 'utf8')) as Record<string, unknown>;
      writeFileSync(join(demo, 'study.json'), JSON.stringify({ ...study, out: '../out' }));
      // the same stages as `lexichron run` (validation, dynamics, term audit as the runner wires them)
      const run = await runStudy(join(demo, 'study.json'), { now: '2026-05-01T00:00:00.000Z', stages: defaultStudyStages() });
      reportPath = (await writeReport(run.outDir)).path;
      context = await chromium.launchPersistentContext(join(work, 'profile'), {
        executablePath: CHROMIUM,
        headless: true,
        args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
        viewport: { width: 1280, height: 900 },
        offline: true,
      });
      const page = await context.newPage();
      page.on('console', (m) => {
        if (m.type() === 'error') consoleErrors.push(m.text());
      });
      page.on('pageerror', (e) => consoleErrors.push(String(e)));
      page.on('request', (r) => requests.push(r.url()));
      await page.goto(pathToFileURL(reportPath).href, { waitUntil: 'load' });
      marks = await page.evaluate(() =>
        [...document.querySelectorAll('svg.chart')].map((svg) => ({
          chart: svg.getAttribute('data-chart') ?? '?',
          marks: [...svg.querySelectorAll('.mark')].filter((m) => {
            const r = m.getBoundingClientRect();
            return r.width > 0 || r.height > 0;
          }).length,
        })),
      );
      // Axis titles drawn outside their chart's box are clipped by the browser.
      clipped = await page.evaluate(() =>
        [...document.querySelectorAll('svg.chart .axis-title')].flatMap((t) => {
          const svg = (t as SVGGraphicsElement).ownerSVGElement as SVGSVGElement;
          const r = t.getBoundingClientRect();
          const s = svg.getBoundingClientRect();
          const inside = r.top >= s.top - 0.5 && r.bottom <= s.bottom + 0.5 && r.left >= s.left - 0.5 && r.right <= s.right + 0.5;
          return inside ? [] : [`${svg.getAttribute('data-chart') ?? '?'}: ${t.textContent ?? ''}`];
        }),
      );
      ratingsRows = await page.evaluate(() => [...document.querySelectorAll('#validation table.ratings-reconciliation tbody tr')].map((tr) => [...tr.querySelectorAll('th,td')].map((c) => (c.textContent ?? '').trim())));
      pageText = await page.evaluate(() => document.body.innerText);
      preBlocks = await page.evaluate(() => document.querySelectorAll('pre').length);
      screenshot = join(work, 'report.png');
      await page.screenshot({ path: screenshot, fullPage: true });
    }, 180_000);

    afterAll(async () => {
      await context?.close();
      rmSync(work, { recursive: true, force: true });
    });

    it('renders the coverage heatmap, the series views, the lag-pair chart and every other chart with visible marks', () => {
      const names = marks.map((m) => m.chart);
      for (const expected of ['coverage-heatmap', 'series-selected', 'lag-pairs']) expect(names).toContain(expected);
      expect(names.filter((n) => n.startsWith('series-small-')).length).toBeGreaterThan(10);
      for (const m of marks) expect(m.marks, `chart ${m.chart} has no visible marks`).toBeGreaterThan(0);
    });

    it('draws every axis title inside its chart, unclipped (the reliability axis among them)', () => {
      expect(clipped).toEqual([]);
    });

    it('shows how the self-reports were read and paired as a table: rows read (as counted by wc -l), kept, values left out by reason, persons', () => {
      // rows read: data lines of demo-data/ratings.csv (its line count less the header, as `wc -l` counts them)
      const ratingsLines = readFileSync(join(root, 'demo-data/ratings.csv'), 'utf8').trimEnd().split('\n').length - 1;
      const count = (label: string): string | undefined => ratingsRows.find((r) => r[0] === label)?.[1];
      expect(count('Rows read')).toBe(ratingsLines.toLocaleString('en-US'));
      expect(count('Rows kept (usable person and time)')).toBe(ratingsLines.toLocaleString('en-US'));
      expect(count('Rows left out')).toBe('0');
      // the demo generator writes two mood values outside 0-100 (scripts/generate-demo.mjs)
      expect(count('Single ratings left out (the rest of the row kept)')).toBe('2');
      expect(count('outside the declared scale')).toBe('2');
      expect(count('Persons')).toBe('36');
    });

    it('shows no raw JSON anywhere on the page: no <pre> block, no quoted keys, no key: value; key: value dumps', () => {
      expect(preBlocks).toBe(0);
      expect(pageText).not.toMatch(/[{[]\s*"|"[A-Za-z_]+"\s*:/);
      expect(pageText).not.toMatch(/\bread: \d+; kept: \d+/);
      expect(pageText).not.toMatch(/\b(rowsWithText|excludedEntries)/);
    });

    it('logs no console error', () => {
      expect(consoleErrors).toEqual([]);
    });

    it('requests nothing but the file itself (only file: and data: URLs)', () => {
      expect(requests.length).toBeGreaterThan(0);
      for (const url of requests) expect(url).toMatch(/^(file|data):/);
    });

    it('takes a full-page screenshot', () => {
      expect(statSync(screenshot).size).toBeGreaterThan(50_000);
    });
  });
}

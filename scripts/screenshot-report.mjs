#!/usr/bin/env node
/**
 * Takes a full-page screenshot of a report with Debian's chromium, headless and with networking
 * off. Usage: node scripts/screenshot-report.mjs [REPORT_HTML] [PNG]
 * (defaults: out/report.html → docs/report-screenshot.png). Needs /usr/bin/chromium
 * (scripts/ci-install-browser.sh installs it).
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium } from 'playwright-core';

const report = resolve(process.argv[2] ?? 'out/report.html');
const png = resolve(process.argv[3] ?? 'docs/report-screenshot.png');
const profile = mkdtempSync(join(tmpdir(), 'lexichron-shot-'));
// a fresh profile folder (playwright passes it to chromium as --user-data-dir)
const browser = await chromium.launchPersistentContext(profile, {
  executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
  headless: true,
  args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  viewport: { width: 1280, height: 900 },
  deviceScaleFactor: 1,
});
try {
  const page = await browser.newPage();
  await page.route(/^(?!file:|data:)/, (route) => route.abort());
  await page.goto(pathToFileURL(report).href, { waitUntil: 'load' });
  const clip = process.argv.includes('--full') ? undefined : { x: 0, y: 0, width: 1280, height: Math.min(2600, await page.evaluate(() => document.documentElement.scrollHeight)) };
  await page.screenshot({ path: png, ...(clip ? { clip } : { fullPage: true }) });
  process.stdout.write(`screenshot: ${png}\n`);
} finally {
  await browser.close();
  rmSync(profile, { recursive: true, force: true });
}

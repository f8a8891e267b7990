// Drives Debian's chromium through playwright-core for the report tests: a fresh profile per run, no
// network, and a record of console messages, page errors, dialogs and every request the page makes.
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

/** Where Debian's chromium package installs the browser (`.ci/run` installs it when missing). */
export const CHROMIUM = process.env.QUERN_CHROMIUM ?? '/usr/bin/chromium';

export const chromiumAvailable = existsSync(CHROMIUM);

const ARGS = [
  '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync',
];

export interface Browser {
  context: BrowserContext;
  close(): Promise<void>;
}

/** Launches chromium with a fresh user-data folder (playwright passes it as --user-data-dir). */
export async function launch(): Promise<Browser> {
  const profile = mkdtempSync(join(tmpdir(), 'quern-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: ARGS,
    viewport: { width: 1200, height: 900 },
    offline: true,
  });
  return {
    context,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** What a page did while it loaded. */
export interface PageRecord {
  page: Page;
  consoleErrors: string[];
  pageErrors: string[];
  dialogs: string[];
  /** Every request other than the report file itself. */
  requests: string[];
}

/** Opens a report file and records what happens; dialogs are dismissed and recorded. */
export async function openReport(browser: Browser, file: string): Promise<PageRecord> {
  const page = await browser.context.newPage();
  const url = pathToFileURL(file).href;
  const rec: PageRecord = { page, consoleErrors: [], pageErrors: [], dialogs: [], requests: [] };
  page.on('console', (m) => { if (m.type() === 'error' || m.type() === 'warning') rec.consoleErrors.push(m.text()); });
  page.on('pageerror', (e) => rec.pageErrors.push(e.message));
  page.on('dialog', (d) => { rec.dialogs.push(d.message()); void d.dismiss(); });
  page.on('request', (r) => { if (r.url() !== url) rec.requests.push(r.url()); });
  await page.goto(url, { waitUntil: 'load' });
  return rec;
}

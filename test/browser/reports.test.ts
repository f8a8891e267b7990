// End-to-end: each analysing command writes `--report FILE.html` for the demo data; headless chromium
// opens it offline and we check what a reader (and a screen reader) gets. Skipped when chromium is absent.
import { mkdirSync, mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { runCli } from '../helpers/cli.js';
import { chromiumAvailable, CHROMIUM, launch, openReport, type Browser, type PageRecord } from './chromium.js';

vi.setConfig({ testTimeout: 60_000, hookTimeout: 60_000 }); // a browser and a CLI run per test

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const SHOTS = join(ROOT, 'test-output', 'screenshots');
/** Demo files by the relative name a user would type (the CLI runs with cwd at the repository root). */
const fixture = (name: string) => `fixtures/${name}`;

if (!chromiumAvailable) {
  console.warn(`browser tests skipped: no chromium at ${CHROMIUM} (apt-get install -y chromium, or set QUERN_CHROMIUM)`);
}

interface Case {
  name: string;
  args: (out: string) => string[];
  /** Selectors that must be present, with the least number of matches. */
  expect: Array<[string, number]>;
  /** The part of the page photographed for the README (test-output/screenshots/NAME-readme.png). */
  readme?: string;
}

const CASES: Case[] = [
  { name: 'profile', args: (o) => ['profile', fixture('visits.csv'), '--report', o], expect: [['article.q-card', 8], ['article.q-card svg[role="img"]', 4]], readme: '.q-cards' },
  { name: 'grain', args: (o) => ['grain', fixture('visits.csv'), '--report', o], expect: [['.q-tiles figure svg[role="img"]', 4], ['svg[data-chart$="-zone"]', 1]] },
  { name: 'grain-weekly', args: (o) => ['grain', fixture('weekly-cases.csv'), '--report', o], expect: [['.q-tiles figure svg[role="img"]', 8]], readme: '.q-tiles' },
  {
    name: 'rebin',
    args: (o) => ['rebin', fixture('visits.csv'), '--time', 'visit_time', '--unit', 'week', '--zone', 'America/Chicago', '--by', 'clinic', '--out', join(dirname(o), 'rebin.csv'), '--quiet', '--report', o],
    expect: [['.q-multiples svg[role="img"]', 5], ['.q-filled', 1]],
    readme: '.q-multiples',
  },
  {
    name: 'gaps',
    args: (o) => ['gaps', fixture('fridge-temps.csv'), '--time', 'reading_time', '--by', 'fridge_id', '--unit', 'minute', '--step', '15', '--report', o],
    expect: [['svg[role="img"] .q-missing', 1], ['svg[role="img"] .q-duplicated', 1]],
    readme: 'section:has(.q-missing) figure',
  },
  {
    name: 'overlaps',
    args: (o) => ['overlaps', fixture('reporting-periods.csv'), '--start', 'period_start', '--end', 'period_end', '--by', 'programme', '--report', o],
    expect: [['svg[role="img"] .q-range', 3], ['svg[role="img"] .q-overlap', 1], ['svg[role="img"] .q-hole', 1]],
  },
  {
    name: 'overlaps-bands',
    args: (o) => ['overlaps', fixture('age-bands.csv'), '--range', 'label', '--domain', '0..', '--report', o],
    expect: [['svg[role="img"] .q-range', 9], ['svg[role="img"] .q-overlap', 1], ['svg[role="img"] .q-hole', 1]],
    readme: 'section:has(.q-overlap) figure',
  },
  {
    name: 'bucket',
    args: (o) => ['bucket', fixture('visits.csv'), '--value', 'patient_age', '--scheme', 'five-year-85', '--summary', '--report', o],
    expect: [['svg[data-chart="bucket-ranges"] .q-bar', 18]],
    readme: 'section:has(svg[data-chart="bucket-ranges"]) figure',
  },
];

/** The text alternative of every chart: role img, named by a non-empty title and described by a sentence. */
async function chartAlternatives(rec: PageRecord): Promise<Array<{ name: string; desc: string }>> {
  return rec.page.$$eval('svg.q-chart', (svgs) =>
    svgs.map((s) => {
      const [t, d] = (s.getAttribute('aria-labelledby') ?? '').split(' ');
      return {
        role: s.getAttribute('role'),
        name: document.getElementById(t)?.textContent ?? '',
        desc: document.getElementById(d)?.textContent ?? '',
      };
    }).map((x) => ({ name: x.role === 'img' ? x.name : '', desc: x.desc })),
  );
}

/** Elements that data could have injected: none may exist in a report. */
const INJECTED = 'script, img, iframe, object, embed, a[href], [onerror], [onload], [onclick], [onmouseover], [onfocus]';

describe.skipIf(!chromiumAvailable)('HTML reports in chromium', () => {
  let browser: Browser;
  let dir: string;

  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'quern-reports-'));
    mkdirSync(SHOTS, { recursive: true });
    browser = await launch();
  });

  afterAll(async () => {
    await browser?.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it.each(CASES)('quern $name --report writes a page with its charts, tables and text alternatives', async (c) => {
    const out = join(dir, `${c.name}.html`);
    const r = await runCli(c.args(out), { cwd: ROOT });
    expect([0, 1], r.stderr).toContain(r.status); // 1: --check-style findings are not failures here
    expect(statSync(out).size).toBeLessThan(400_000); // the issue: under a few hundred KB for the demo data
    const rec = await openReport(browser, out);
    try {
      expect(rec.consoleErrors).toEqual([]);
      expect(rec.pageErrors).toEqual([]);
      expect(rec.requests).toEqual([]); // nothing fetched: fonts, images, scripts all inline or absent
      for (const [selector, least] of c.expect) {
        expect(await rec.page.locator(selector).count(), selector).toBeGreaterThanOrEqual(least);
      }
      const alts = await chartAlternatives(rec);
      expect(alts.length).toBeGreaterThan(0);
      for (const a of alts) {
        expect(a.name.trim().length, 'chart title').toBeGreaterThan(0);
        expect(a.desc.trim(), 'chart description').toMatch(/\w.*\./);
      }
      // every chart sits in a figure that also holds a table of its numbers (or in a grid of such figures)
      const orphans = await rec.page.$$eval('svg.q-chart', (svgs) =>
        svgs.filter((s) => !(s.closest('figure') ?? s.closest('section'))?.querySelector('table')).length,
      );
      expect(orphans).toBe(0);
      expect(await rec.page.locator(INJECTED).count()).toBe(0);
      await rec.page.screenshot({ path: join(SHOTS, `${c.name}.png`), fullPage: true });
      await rec.page.screenshot({ path: join(SHOTS, `${c.name}-top.png`), clip: { x: 0, y: 0, width: 1200, height: 820 } });
      if (c.readme) {
        // small enough for the README (< ~150 KB): the part of the page that answers the command's question
        const box = await rec.page.locator(c.readme).first().boundingBox();
        if (box) await rec.page.screenshot({ path: join(SHOTS, `${c.name}-readme.png`), fullPage: true, clip: { x: box.x, y: box.y, width: box.width, height: Math.min(box.height, 760) } });
      }
      // 200% zoom: half the CSS width; the page reflows instead of scrolling sideways
      await rec.page.setViewportSize({ width: 600, height: 900 });
      const overflow = await rec.page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
      expect(overflow).toBeLessThanOrEqual(1);
      await rec.page.screenshot({ path: join(SHOTS, `${c.name}-zoom200.png`), fullPage: false });
      // printed: table boxes drop their scroll so every row prints (CSS print media rules)
      await rec.page.emulateMedia({ media: 'print' });
      const clipped = await rec.page.$$eval('.q-table-box', (boxes) => boxes.filter((b) => getComputedStyle(b).overflow !== 'visible').length);
      expect(clipped).toBe(0);
    } finally {
      await rec.page.close();
    }
  });

  describe('a hostile CSV', () => {
    const SVG = '<svg onload=alert(1)>';
    const HOSTILE = ['<script>alert(1)</script>', '<img src=x onerror=alert(1)>', 'javascript:alert(1)', '=HYPERLINK("http://x.invalid","click")'];
    const csv = (cells: string[]) => cells.map((c) => `"${c.replace(/"/g, '""')}"`).join(',');
    let file: string;
    let ranges: string;

    beforeAll(() => {
      file = join(dir, 'hostile.csv');
      // a header that is markup too: its values are dates, so grain and profile print its name
      const lines = [`visit_time,clinic,reason,patient_age,${csv([SVG])}`];
      for (let d = 1; d <= 12; d++) {
        const day = `2024-01-${String(d).padStart(2, '0')}`;
        const h = HOSTILE[d % HOSTILE.length];
        lines.push(csv([`${day}T08:00:00-06:00`, h, HOSTILE[(d + 1) % HOSTILE.length], String(d * 7), day]));
      }
      writeFileSync(file, `${lines.join('\n')}\n`);
      ranges = join(dir, 'hostile-ranges.csv');
      writeFileSync(ranges, `key,low,high\n${HOSTILE.map((h, i) => csv([h, String(i * 10), String(i * 10 + 15)])).join('\n')}\n`);
    });

    const RUNS: Array<[string, (f: string, r: string, o: string) => string[]]> = [
      ['profile', (f, _r, o) => ['profile', f, '--report', o]],
      ['grain', (f, _r, o) => ['grain', f, '--report', o]],
      ['rebin', (f, _r, o) => ['rebin', f, '--time', 'visit_time', '--unit', 'day', '--by', 'clinic', '--out', `${o}.csv`, '--quiet', '--report', o]],
      ['gaps', (f, _r, o) => ['gaps', f, '--time', 'visit_time', '--unit', 'day', '--by', 'clinic', '--report', o]],
      ['overlaps', (_f, r, o) => ['overlaps', r, '--start', 'low', '--end', 'high', '--by', 'key', '--report', o]],
      ['bucket', (f, _r, o) => ['bucket', f, '--value', 'patient_age', '--edges', '0,30,60', '--summary', '--report', o]],
    ];

    it.each(RUNS)('quern %s --report shows hostile cells as inert text', async (name, args) => {
      const out = join(dir, `hostile-${name}.html`);
      const r = await runCli(args(file, ranges, out), { cwd: ROOT });
      expect([0, 1], r.stderr).toContain(r.status);
      const rec = await openReport(browser, out);
      try {
        expect(rec.dialogs).toEqual([]); // no alert() ran
        expect(rec.pageErrors).toEqual([]);
        expect(rec.requests).toEqual([]); // no x.invalid fetched, no img src loaded
        expect(await rec.page.locator(INJECTED).count()).toBe(0);
        const text = await rec.page.evaluate(() => document.body.textContent ?? '');
        // the reports that print data values show every hostile cell literally; grain and profile print the header
        const expected = { profile: [...HOSTILE, SVG], grain: [SVG], rebin: HOSTILE, gaps: HOSTILE, overlaps: HOSTILE, bucket: [] }[name] ?? [];
        for (const h of expected) expect(text, `${name} shows ${h} as text`).toContain(h);
        expect(await rec.page.locator('svg svg, svg[onload]').count()).toBe(0);
        if (name !== 'bucket') await rec.page.screenshot({ path: join(SHOTS, `hostile-${name}.png`), fullPage: true });
      } finally {
        await rec.page.close();
      }
    });
  });
});

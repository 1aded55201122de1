// The HTML reports of whole corpora (GUM and IcePaHC, CC BY 4.0; the IcePaHC gold
// UD CC BY-SA 4.0) in headless Chromium (Debian package chromium, installed by
// .ci/run), driven through its DevTools protocol: no console message, every link
// inside the page leads somewhere, nothing wider than the window outside the
// scroll areas, and a drawn example on screen when its link is followed.
// Screenshots go to TREEBRIDGE_SCREENSHOTS or a temporary folder, named on the
// test's output, for a person to look at. A missing browser fails the test.
import { existsSync, mkdirSync, mkdtempSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Browser, chromium } from '../support/browser.js';
import { cli } from '../support/cli.js';
import { corpusFiles } from '../support/corpora.js';

const folder = mkdtempSync(join(tmpdir(), 'treebridge-reports-'));
const screenshots = process.env.TREEBRIDGE_SCREENSHOTS ?? join(folder, 'screenshots');
mkdirSync(screenshots, { recursive: true });

const gum = { trees: corpusFiles('gum/const', '.ptb'), gold: corpusFiles('gum/dep', '.conllu'), tables: ['--heads', 'en-content', '--labels', 'en-ud', '--pos-map', 'en-ptb'] };
const icepahc = {
  trees: corpusFiles('icepahc', '.psd'),
  gold: corpusFiles('icepahc-ud', '.conllu'),
  tables: ['--heads', 'penn-historical', '--labels', 'penn-historical', '--pos-map', 'penn-historical', '--lemmas'],
};

const pages: Array<[string, () => string[]]> = [
  ['round trip, GUM', () => ['roundtrip', ...gum.tables, ...gum.trees]],
  ['round trip, IcePaHC', () => ['roundtrip', ...icepahc.tables, ...icepahc.trees]],
  ['head table tuning, GUM', () => ['heads', 'score', ...gum.tables, ...gum.trees, '--gold', ...gum.gold]],
  ['head table tuning, IcePaHC', () => ['heads', 'score', ...icepahc.tables, '--unscored', 'Align=absorbed,extra', ...icepahc.trees, '--gold', ...icepahc.gold]],
];

describe('the HTML reports of whole corpora in headless Chromium', () => {
  let browser: Browser;
  beforeAll(() => {
    expect(existsSync(chromium), `Chromium not found at ${chromium}`).toBe(true);
    browser = Browser.launch();
  });
  afterAll(() => browser?.close());

  it.each(pages)('%s: loads without a console message, every link leads somewhere, an example shows when followed', async (name, args) => {
    const file = join(folder, `${name.replace(/[^a-z]+/gi, '-')}.html`);
    const run = await cli([...args(), '--report', file, '--quiet']);
    expect(run.code, run.stderr).toBe(0);
    expect(run.stderr).toContain(`report written to ${file}`);
    const { page, loadMs } = await browser.open(`file://${file}`);
    console.log(`${name}: ${(statSync(file).size / 1e6).toFixed(1)} MB, loaded in ${Math.round(loadMs)} ms`);
    const links = await page.evaluate<{ inside: number; broken: string[]; summary: number }>(`(() => {
      const inside = [...document.querySelectorAll('a[href^="#"]')];
      return {
        inside: inside.length,
        broken: inside.filter((a) => !document.getElementById(decodeURIComponent(a.getAttribute('href').slice(1)))).map((a) => a.getAttribute('href')),
        summary: document.querySelectorAll('table.summary a[href^="#"]').length,
      };
    })()`);
    expect(links.broken).toEqual([]);
    expect(links.summary).toBeGreaterThan(0);
    // Drawings scroll inside their own areas: the page itself never gets wider than the window.
    const widths = await page.evaluate<[number, number]>('[document.documentElement.scrollWidth, window.innerWidth]');
    expect(widths[0]).toBeLessThanOrEqual(widths[1]);
    // Following the first example link brings its drawn sentence into view.
    const shown = await page.evaluate<{ top: number; height: number; drawings: number }>(`(() => {
      const link = document.querySelector('table.summary a[href^="#"]');
      location.hash = link.getAttribute('href');
      const target = document.getElementById(link.getAttribute('href').slice(1));
      return { top: target.getBoundingClientRect().top, height: window.innerHeight, drawings: target.closest('section.sentence').querySelectorAll('svg').length };
    })()`);
    expect(shown.top).toBeGreaterThan(-1); // at the top, give or take a rounded pixel
    expect(shown.top).toBeLessThan(shown.height);
    expect(shown.drawings).toBe(3);
    const shot = join(screenshots, `${name.replace(/[^a-z]+/gi, '-')}.png`);
    const bytes = await page.screenshot(shot);
    console.log(`  screenshot of the first example: ${shot}`);
    expect(bytes).toBeGreaterThan(20_000);
    expect(page.console).toEqual([]);
  });
});

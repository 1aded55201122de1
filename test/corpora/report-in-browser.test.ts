// The round-trip report of real data (GUM, CC BY 4.0) opens in headless Chromium
// (Debian package chromium, installed by .ci/run) without console messages; a
// missing browser fails the test.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cli } from '../support/cli.js';
import { corpusFiles } from '../support/corpora.js';

const chromium = process.env.TREEBRIDGE_CHROMIUM ?? '/usr/bin/chromium';

describe('the HTML round-trip report', () => {
  it('opens in headless Chromium without console messages, drawing the sentences with losses', async () => {
    expect(existsSync(chromium), `Chromium not found at ${chromium}`).toBe(true);
    const dir = mkdtempSync(join(tmpdir(), 'treebridge-report-'));
    const page = join(dir, 'report.html');
    const files = corpusFiles('gum/const', '.ptb').slice(0, 20);
    const { code } = await cli(['roundtrip', '--heads', 'en-content', '--pos-map', 'en-ptb', '--report', page, '--report-limit', '5', ...files]);
    expect(code).toBe(0);
    expect(statSync(page).size).toBeLessThan(5_000_000);
    const flags = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
    const run = (url: string) => {
      const profile = mkdtempSync(join(tmpdir(), 'treebridge-chromium-'));
      const result = execFileSync(chromium, [...flags, `--user-data-dir=${profile}`, '--enable-logging=stderr', '--v=0', '--dump-dom', url], {
        encoding: 'utf8',
        stdio: ['ignore', 'pipe', 'pipe'],
        maxBuffer: 1 << 28,
        timeout: 120_000,
      });
      return result;
    };
    const dom = run(`file://${page}`);
    expect(dom).toContain('<svg class="bracketing"');
    expect(dom).toContain('<svg class="dependencies"');
    // Console messages appear on standard error as CONSOLE lines; capture it with a second run through a shell.
    const log = execFileSync('bash', ['-c', `"${chromium}" ${flags.join(' ')} --user-data-dir=$(mktemp -d) --enable-logging=stderr --v=0 --dump-dom "file://${page}" 2>&1 >/dev/null | grep -c CONSOLE || true`], { encoding: 'utf8', timeout: 120_000 });
    expect(log.trim()).toBe('0');
  });
});

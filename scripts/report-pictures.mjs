#!/usr/bin/env node
// node scripts/report-pictures.mjs (after npm run build): the pictures of the two report pages
// in the README, made from the invented demo data. Each page is written by the command the README
// shows, then photographed from its top by headless Chromium (Debian package chromium, or
// TREEBRIDGE_CHROMIUM) into docs/pictures/.
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const bin = join(root, 'dist/src/bin/treebridge.js');
const chromium = process.env.TREEBRIDGE_CHROMIUM ?? '/usr/bin/chromium';
const pages = join(root, 'demo-output');
const pictures = join(root, 'docs/pictures');
mkdirSync(pages, { recursive: true });
mkdirSync(pictures, { recursive: true });

const shots = [
  {
    name: 'tuning',
    args: ['heads', 'score', '--heads', 'en-function', '--labels', 'en-ud', 'demo-data/harbour.psd', '--gold', 'demo-data/harbour-gold.conllu', '--report', 'demo-output/harbour-tuning.html'],
    height: 1500,
  },
  {
    name: 'round-trip',
    args: ['roundtrip', '--heads', 'en-content', '--pos-map', 'en-ptb', 'demo-data/harbour.psd', '--report', 'demo-output/harbour-losses.html'],
    height: 1500,
  },
];

for (const shot of shots) {
  execFileSync(process.execPath, [bin, ...shot.args, '--quiet'], { cwd: root, stdio: ['ignore', 'ignore', 'inherit'] });
  const page = join(root, shot.args[shot.args.indexOf('--report') + 1]);
  const profile = mkdtempSync(join(tmpdir(), 'treebridge-pictures-'));
  execFileSync(chromium, ['--headless', '--no-sandbox', '--disable-gpu', '--hide-scrollbars', `--user-data-dir=${profile}`, `--window-size=1100,${shot.height}`, `--screenshot=${join(pictures, `${shot.name}.png`)}`, `file://${page}`], { stdio: 'ignore' });
  console.log(`docs/pictures/${shot.name}.png from ${shot.args.slice(0, shot.args.indexOf('--report')).join(' ')}`);
}

// npm run bench: reading throughput and peak memory of treebridge's bracketed
// reader beside NLTK's reader (Debian python3-nltk) on the same files, in one run.
// Data: IcePaHC (CC BY 4.0) from ../shared/corpora, or TREEBRIDGE_CORPORA.
// Each reader runs in a fresh process, several times, alternating, and the
// fastest run counts for each (as Python's timeit advises): on a shared machine
// slow runs measure the neighbours, and alternating exposes both readers to the same drift.
import { execFileSync } from 'node:child_process';
import { createReadStream, createWriteStream, existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { pipeline } from 'node:stream/promises';
import { fileURLToPath } from 'node:url';

interface Measure {
  trees: number;
  seconds: number;
  peakMB: number;
}

const here = dirname(fileURLToPath(import.meta.url));
const root = resolve(here, '../..');
const corpora = process.env.TREEBRIDGE_CORPORA ?? resolve(root, '../shared/corpora');
const python = process.env.TREEBRIDGE_PYTHON ?? '/usr/bin/python3';
const rounds = Number(process.env.TREEBRIDGE_BENCH_ROUNDS ?? 5);
const folder = join(corpora, 'icepahc');
if (!existsSync(folder)) throw new Error(`IcePaHC not found at ${folder} (set TREEBRIDGE_CORPORA)`);
const files = readdirSync(folder).filter((name) => name.endsWith('.psd')).sort().map((name) => join(folder, name));
const megabytes = files.reduce((sum, file) => sum + statSync(file).size, 0) / 1048576;

/** The Node flags the treebridge command runs with, from its first line, so that the reader is measured as the command runs it. */
const nodeFlags = readFileSync(join(here, '../src/bin/treebridge.js'), 'utf8').split('\n', 1)[0]!.split(/\s+/).filter((word) => word.startsWith('--'));
const ours = (inputs: string[]): Measure =>
  JSON.parse(execFileSync(process.execPath, [...nodeFlags, join(here, 'read-worker.js'), ...inputs], { encoding: 'utf8', maxBuffer: 1 << 24 }));
const nltk = (inputs: string[]): Measure =>
  JSON.parse(execFileSync(python, [join(root, 'test/support/nltk-trees.py'), 'time', ...inputs], { encoding: 'utf8', maxBuffer: 1 << 24 }));

/** The fastest run, with the highest peak memory of all runs. */
function fastest(measures: Measure[]): Measure {
  const best = measures.reduce((a, b) => (b.seconds < a.seconds ? b : a));
  return { ...best, peakMB: Math.max(...measures.map((m) => m.peakMB)) };
}

const row = (name: string, size: number, m: Measure) =>
  `${name.padEnd(30)} ${m.trees.toString().padStart(8)} ${m.seconds.toFixed(2).padStart(8)} ${(size / m.seconds).toFixed(1).padStart(7)} ${Math.round(m.trees / m.seconds).toString().padStart(9)} ${m.peakMB.toFixed(0).padStart(8)}`;

console.log(`IcePaHC: ${files.length} files, ${megabytes.toFixed(1)} MB; fastest of ${rounds} alternating runs each`);
console.log(`treebridge runs as the command does: node ${nodeFlags.join(' ')}\n`);
console.log(`${'reader'.padEnd(30)} ${'trees'.padStart(8)} ${'seconds'.padStart(8)} ${'MB/s'.padStart(7)} ${'trees/s'.padStart(9)} ${'peak MB'.padStart(8)}`);
const ourRuns: Measure[] = [];
const theirRuns: Measure[] = [];
for (let round = 0; round < rounds; round++) {
  ourRuns.push(ours(files));
  theirRuns.push(nltk(files));
}
const treebridge = fastest(ourRuns);
const reference = fastest(theirRuns);
console.log(row('treebridge', megabytes, treebridge));
console.log(row('NLTK (python3-nltk)', megabytes, reference));

const dir = mkdtempSync(join(tmpdir(), 'treebridge-bench-'));
try {
  const big = join(dir, 'icepahc-x10.psd');
  const out = createWriteStream(big);
  out.setMaxListeners(0);
  for (let copy = 0; copy < 10; copy++) {
    for (const file of files) await pipeline(createReadStream(file), out, { end: false });
  }
  await new Promise<void>((done) => out.end(done));
  const bigMeasure = ours([big]);
  console.log(row('treebridge, 10x in one file', megabytes * 10, bigMeasure));
  console.log('');
  const runs = (measures: Measure[]) => measures.map((m) => m.seconds.toFixed(2)).join(' ');
  console.log(`runs (s): treebridge ${runs(ourRuns)}; NLTK ${runs(theirRuns)}`);
  console.log(`speed: treebridge reads ${(reference.seconds / treebridge.seconds).toFixed(1)}x as fast as NLTK (target: at least 3x)`);
  console.log(`trees agree: ${treebridge.trees === reference.trees ? 'yes' : 'NO'} (${treebridge.trees} and ${reference.trees})`);
  console.log(
    `memory: peak ${treebridge.peakMB.toFixed(0)} MB reading ${megabytes.toFixed(0)} MB, ${bigMeasure.peakMB.toFixed(0)} MB reading ${(megabytes * 10).toFixed(0)} MB ` +
      `(${(bigMeasure.peakMB / treebridge.peakMB).toFixed(2)}x the memory for 10x the input; target: under 200 MB)`,
  );
} finally {
  rmSync(dir, { recursive: true, force: true });
}

// Conversion: read + convert + write, IcePaHC with penn-historical, beside NLTK's reading time of the same files.
const convertRuns: Measure[] = [];
for (let round = 0; round < rounds; round++) {
  convertRuns.push(JSON.parse(execFileSync(process.execPath, [...nodeFlags, join(here, 'convert-worker.js'), 'penn-historical', ...files], { encoding: 'utf8', maxBuffer: 1 << 24 })));
}
const conversion = fastest(convertRuns) as Measure & { words: number };
console.log(`\nconversion of IcePaHC to CoNLL-U with penn-historical (read + convert + write; fastest of ${rounds}):`);
console.log(row('treebridge to-deps', megabytes, conversion) + `   (${Math.round(conversion.words / conversion.seconds).toLocaleString('en-US')} words/s)`);
console.log(`conversion takes ${(conversion.seconds / reference.seconds).toFixed(2)}x the time NLTK takes only to read the same files (target: under 1)`);

// Round trip: IcePaHC brackets → dependencies → brackets with penn-historical, scored.
const roundRuns: Measure[] = [];
for (let round = 0; round < rounds; round++) {
  roundRuns.push(JSON.parse(execFileSync(process.execPath, [...nodeFlags, join(here, 'roundtrip-worker.js'), 'penn-historical', ...files], { encoding: 'utf8', maxBuffer: 1 << 24 })));
}
const roundTrip = fastest(roundRuns);
console.log(`\nround trip of IcePaHC with penn-historical (read, to dependencies, back to brackets, scored; fastest of ${rounds}):`);
console.log(row('treebridge roundtrip', megabytes, roundTrip));
console.log(`round trip takes ${(roundTrip.seconds / reference.seconds).toFixed(2)}x the time NLTK takes only to read the same files`);

// stats: structure analysis of every shared CoNLL-U file (GUM dep CC BY 4.0; UD EWT and CAC dev CC BY-SA 4.0).
const conllu = ['gum/dep', 'ud'].flatMap((sub) =>
  readdirSync(join(corpora, sub)).filter((name) => name.endsWith('.conllu')).sort().map((name) => join(corpora, sub, name)),
);
const conlluMB = conllu.reduce((sum, file) => sum + statSync(file).size, 0) / 1048576;
const statsRuns: Measure[] = [];
for (let round = 0; round < rounds; round++) {
  statsRuns.push(JSON.parse(execFileSync(process.execPath, [...nodeFlags, join(here, 'stats-worker.js'), ...conllu], { encoding: 'utf8', maxBuffer: 1 << 24 })));
}
const statsMeasure = fastest(statsRuns);
const words = (statsMeasure as Measure & { words: number }).words;
console.log(`
stats on ${conllu.length} CoNLL-U files, ${conlluMB.toFixed(1)} MB (fastest of ${rounds}):`);
console.log(`${'reader'.padEnd(30)} ${'sentences'.padStart(9)} ${'seconds'.padStart(8)} ${'MB/s'.padStart(7)} ${'sent./s'.padStart(9)} ${'peak MB'.padStart(8)}`);
console.log(row('treebridge stats', conlluMB, statsMeasure) + `   (${Math.round(words / statsMeasure.seconds).toLocaleString('en-US')} words/s)`);

// to-brackets: bracketings rebuilt from every shared CoNLL-U file.
const bracketRuns: Measure[] = [];
for (let round = 0; round < rounds; round++) {
  bracketRuns.push(JSON.parse(execFileSync(process.execPath, [...nodeFlags, join(here, 'to-brackets-worker.js'), ...conllu], { encoding: 'utf8', maxBuffer: 1 << 24 })));
}
const bracketing = fastest(bracketRuns) as Measure & { words: number };
console.log(`\nto-brackets on the same files (read + lift + build + write, flat shape; fastest of ${rounds}):`);
console.log(row('treebridge to-brackets', conlluMB, bracketing) + `   (${Math.round(bracketing.words / bracketing.seconds).toLocaleString('en-US')} words/s)`);

// The XML graph encoding: IcePaHC with traces resolved, written as one document and read back;
// beside it, Python's standard xml.etree.ElementTree (a reference library) parsing the same document.
{
  const dir = mkdtempSync(join(tmpdir(), 'treebridge-bench-xml-'));
  try {
    const xml = join(dir, 'icepahc.xml');
    const writeRuns: Measure[] = [];
    const readRuns: Measure[] = [];
    const parseRuns: Measure[] = [];
    const worker = (args: string[]): Measure =>
      JSON.parse(execFileSync(process.execPath, [...nodeFlags, join(here, 'xml-worker.js'), ...args], { encoding: 'utf8', maxBuffer: 1 << 24 }));
    for (let round = 0; round < rounds; round++) {
      writeRuns.push(worker(['write', xml, ...files]));
      readRuns.push(worker(['read', xml]));
      parseRuns.push(JSON.parse(execFileSync(python, [join(root, 'test/support/xml-graph-check.py'), '--time', xml], { encoding: 'utf8' })));
    }
    const xmlMB = statSync(xml).size / 1048576;
    const written = fastest(writeRuns);
    const read = fastest(readRuns);
    const parsed = fastest(parseRuns);
    console.log(`\nXML graph encoding: IcePaHC with traces resolved, ${xmlMB.toFixed(1)} MB of XML (fastest of ${rounds}):`);
    console.log(`${'step'.padEnd(30)} ${'trees'.padStart(8)} ${'seconds'.padStart(8)} ${'MB/s'.padStart(7)} ${'trees/s'.padStart(9)} ${'peak MB'.padStart(8)}`);
    console.log(row('treebridge resolve + write', xmlMB, written));
    console.log(row('treebridge read', xmlMB, read));
    console.log(row('ElementTree iterparse only', xmlMB, parsed));
    console.log(`reading builds the trees in ${(read.seconds / parsed.seconds).toFixed(2)}x the time Python's ElementTree takes only to parse the same XML`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

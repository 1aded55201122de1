// npm run bench: reading throughput and peak memory of treebridge's bracketed
// reader beside NLTK's reader (Debian python3-nltk) on the same files, in one run.
// Data: IcePaHC (CC BY 4.0) from ../shared/corpora, or TREEBRIDGE_CORPORA.
// Each reader runs in a fresh process, several times, alternating, and the
// fastest run counts for each (as Python's timeit advises): on a shared machine
// slow runs measure the neighbours, and alternating exposes both readers to the same drift.
import { execFileSync, spawnSync } from 'node:child_process';
import { appendFileSync, createReadStream, createWriteStream, existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { availableParallelism, devNull, tmpdir } from 'node:os';
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

// The command itself, as a user runs it: all IcePaHC texts in one file, to CoNLL-U with the
// penn-historical head, label and word tables, at --jobs 1 and at one job per core; beside it,
// NLTK reading the same file and a bare scan of its brackets. Then ten copies of the file, for
// peak memory of to-deps, validate and stats (on the CoNLL-U written from the ten copies).
{
  const dir = mkdtempSync(join(tmpdir(), 'treebridge-bench-cli-'));
  try {
    const one = join(dir, 'icepahc.psd');
    const ten = join(dir, 'icepahc-x10.psd');
    const onePieces = files.map((file) => readFileSync(file, 'utf8').replace(/\n?$/, '\n'));
    writeFileSync(one, onePieces.join(''));
    writeFileSync(ten, '');
    for (let copy = 0; copy < 10; copy++) appendFileSync(ten, onePieces.join(''));
    const oneMB = statSync(one).size / 1048576;
    const tenMB = statSync(ten).size / 1048576;
    const record = join(dir, 'record.json');
    const command = (args: string[]): Measure => {
      const run = spawnSync(process.execPath, [...nodeFlags, '--import', join(root, 'bench/peak-memory.mjs'), join(here, '../src/bin/treebridge.js'), ...args], {
        stdio: 'ignore',
        env: { ...process.env, TREEBRIDGE_BENCH_RECORD: record },
      });
      // 1 says the input has problems (the corpus has a few); anything else is a failure of the run.
      if (run.status !== 0 && run.status !== 1) throw new Error(`treebridge ${args.join(' ')} exited ${run.status}`);
      const measured = JSON.parse(readFileSync(record, 'utf8')) as { seconds: number; peakMB: number };
      return { trees: 0, ...measured };
    };
    const tables = ['--heads', 'penn-historical', '--labels', 'penn-historical', '--pos-map', 'penn-historical', '--lemmas', '--quiet'];
    const cores = availableParallelism();
    const toDeps = (input: string, jobs: number, output = devNull) => command(['to-deps', ...tables, '--jobs', String(jobs), input, '-o', output]);
    const scanRuns: number[] = [];
    const nltkRuns: Measure[] = [];
    const jobRuns = new Map<number, Measure[]>([[1, []], [cores, []]]);
    for (let round = 0; round < rounds; round++) {
      nltkRuns.push(nltk([one]));
      for (const jobs of jobRuns.keys()) jobRuns.get(jobs)!.push(toDeps(one, jobs));
      const started = process.hrtime.bigint();
      bareScan(readFileSync(one, 'utf8'));
      scanRuns.push(Number(process.hrtime.bigint() - started) / 1e9);
    }
    const read = fastest(nltkRuns);
    const oneConllu = join(dir, 'icepahc.conllu');
    toDeps(one, 1, oneConllu);
    const words = readFileSync(oneConllu, 'utf8').split('\n').filter((row) => /^\d+\t/.test(row)).length;
    console.log(`\nthe command on all IcePaHC in one file, ${oneMB.toFixed(1)} MB, ${words.toLocaleString('en-US')} words: to-deps with penn-historical heads, labels and word table (fastest of ${rounds}; ${cores} cores):`);
    console.log(`${'run'.padEnd(30)} ${'seconds'.padStart(8)} ${'words/s'.padStart(10)} ${'peak MB'.padStart(8)} ${'÷ NLTK read'.padStart(12)}`);
    const line = (name: string, m: Measure) =>
      console.log(`${name.padEnd(30)} ${m.seconds.toFixed(2).padStart(8)} ${Math.round(words / m.seconds).toLocaleString('en-US').padStart(10)} ${m.peakMB.toFixed(0).padStart(8)} ${(m.seconds / read.seconds).toFixed(2).padStart(12)}`);
    line('NLTK reads the trees', read);
    line('bare scan of the brackets', { trees: 0, seconds: Math.min(...scanRuns), peakMB: 0 });
    for (const [jobs, runs] of jobRuns) line(`treebridge to-deps --jobs ${jobs}`, fastest(runs));
    console.log(`targets: --jobs 1 at most 0.5x and --jobs 2 at most 0.3x NLTK's read time`);

    const conllu = join(dir, 'icepahc-x10.conllu');
    const bigDeps = new Map<number, Measure>([...jobRuns.keys()].map((jobs) => [jobs, toDeps(ten, jobs, jobs === 1 ? conllu : devNull)]));
    const validate = command(['validate', ten]);
    const oneValidate = command(['validate', one]);
    const stats = command(['stats', conllu]);
    console.log(`\npeak memory (MB), ${oneMB.toFixed(0)} MB and ten copies in one file, ${tenMB.toFixed(0)} MB (target: at most 150 for each):`);
    for (const [jobs, runs] of jobRuns) console.log(`  to-deps --jobs ${jobs}: ${fastest(runs).peakMB.toFixed(0)} and ${bigDeps.get(jobs)!.peakMB.toFixed(0)}`);
    console.log(`  validate: ${oneValidate.peakMB.toFixed(0)} and ${validate.peakMB.toFixed(0)}`);
    console.log(`  stats on the CoNLL-U of the ten copies (${(statSync(conllu).size / 1048576).toFixed(0)} MB): ${stats.peakMB.toFixed(0)}`);
    const bigValidate = command(['validate', conllu]);
    console.log(`  validate on the CoNLL-U of the ten copies: ${bigValidate.peakMB.toFixed(0)}`);

    // The other commands that read the trees: validate, round trip, and heads score against the UD
    // version of the same texts (CC BY-SA 4.0), at --jobs 1 and one job per core.
    const gold = readdirSync(join(corpora, 'icepahc-ud')).filter((name) => name.endsWith('.conllu')).sort().map((name) => join(corpora, 'icepahc-ud', name));
    console.log(`\nother commands on the bracketed file (fastest of ${rounds}):`);
    console.log(`${'run'.padEnd(30)} ${'seconds'.padStart(8)} ${'words/s'.padStart(10)} ${'peak MB'.padStart(8)} ${'÷ --jobs 1'.padStart(12)}`);
    for (const args of [
      ['validate', '--lemmas', one],
      ['roundtrip', ...tables.filter((arg) => arg !== '--quiet'), one],
      ['heads', 'score', ...files, '--gold', ...gold, ...tables.filter((arg) => arg !== '--quiet'), '--unscored', 'Align=absorbed,extra'],
    ]) {
      let single = 0;
      const name = args[0] === 'heads' ? 'heads score' : args[0]!;
      for (const jobs of jobRuns.keys()) {
        const runs: Measure[] = [];
        for (let round = 0; round < rounds; round++) runs.push(command([...args, '--jobs', String(jobs)]));
        const m = fastest(runs);
        single ||= m.seconds;
        console.log(`${`treebridge ${name} --jobs ${jobs}`.padEnd(30)} ${m.seconds.toFixed(2).padStart(8)} ${Math.round(words / m.seconds).toLocaleString('en-US').padStart(10)} ${m.peakMB.toFixed(0).padStart(8)} ${(m.seconds / single).toFixed(2).padStart(12)}`);
      }
    }

    // The commands that read CoNLL-U, on the CoNLL-U of the file, at --jobs 1 and one job per core.
    console.log(`\ncommands reading the CoNLL-U of the file, ${(statSync(oneConllu).size / 1048576).toFixed(1)} MB (fastest of ${rounds}):`);
    console.log(`${'run'.padEnd(30)} ${'seconds'.padStart(8)} ${'words/s'.padStart(10)} ${'peak MB'.padStart(8)} ${'÷ --jobs 1'.padStart(12)}`);
    for (const args of [['validate'], ['stats'], ['to-brackets', '-o', devNull]]) {
      let single = 0;
      for (const jobs of jobRuns.keys()) {
        const runs: Measure[] = [];
        for (let round = 0; round < rounds; round++) runs.push(command([...args, '--jobs', String(jobs), oneConllu]));
        const m = fastest(runs);
        single ||= m.seconds;
        console.log(`${`treebridge ${args[0]} --jobs ${jobs}`.padEnd(30)} ${m.seconds.toFixed(2).padStart(8)} ${Math.round(words / m.seconds).toLocaleString('en-US').padStart(10)} ${m.peakMB.toFixed(0).padStart(8)} ${(m.seconds / single).toFixed(2).padStart(12)}`);
      }
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** The least work that finds every tree: count brackets, skipping escaped ones. */
function bareScan(text: string): number {
  let depth = 0;
  let trees = 0;
  for (let i = 0; i < text.length; i++) {
    const code = text.charCodeAt(i);
    if (code === 92) i++;
    else if (code === 40) depth++;
    else if (code === 41 && --depth === 0) trees++;
  }
  return trees;
}

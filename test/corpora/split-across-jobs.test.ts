// The commands are stream filters: any split of the input at tree (or
// sentence) boundaries, converted piece by piece and put together in order,
// gives the output of the whole. Checked with GNU parallel (Debian package
// `parallel`, installed by .ci/run) cutting IcePaHC (CC BY 4.0), GUM
// constituency trees and GUM dependencies (CC BY 4.0) into pieces. Every figure
// of the comparison is printed for the issue note.
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bin } from '../support/bin.js';
import { corpusFiles } from '../support/corpora.js';

const parallel = process.env.TREEBRIDGE_PARALLEL ?? '/usr/bin/parallel';
const folder = mkdtempSync(join(tmpdir(), 'treebridge-split-'));

/** The files one after the other, each ending its last line: the recipe's records are trees that begin a line. */
function joined(name: string, files: string[]): string {
  const path = join(folder, name);
  writeFileSync(path, files.map((file) => readFileSync(file, 'utf8').replace(/\n?$/, '\n')).join(''));
  return path;
}

/** Runs a shell pipeline, input from a file, and gives its standard output; a failure fails the test with its standard error. */
function shell(command: string, input: string): string {
  const run = spawnSync('bash', ['-o', 'pipefail', '-c', `${command} < ${JSON.stringify(input)}`], { encoding: 'utf8', maxBuffer: 1 << 30 });
  if (run.status !== 0 && run.status !== 1) throw new Error(`${command} exited ${run.status}: ${run.stderr.slice(0, 2000)}`);
  return run.stdout;
}

const treebridge = `${JSON.stringify(process.execPath)} ${JSON.stringify(bin)}`;

/** The recipe of the README: pieces of N records, each converted with the number of its first tree. */
function pieces(records: number, recordOptions: string, command: string): string {
  return `${parallel} --will-cite --pipe -k --block 8M -N ${records} ${recordOptions} ${command}`;
}

describe('a corpus split across jobs by GNU parallel', () => {
  it('is installed', () => {
    expect(execFileSync(parallel, ['--will-cite', '--version'], { encoding: 'utf8' })).toMatch(/GNU parallel/);
  });

  it('converts IcePaHC piece by piece to the CoNLL-U of the whole, byte for byte', () => {
    const input = joined('icepahc.psd', corpusFiles('icepahc', '.psd'));
    const options = '--heads penn-historical --labels penn-historical --pos-map penn-historical --lemmas --jobs 1 --quiet';
    const whole = shell(`${treebridge} to-deps ${options} -`, input);
    const split = shell(pieces(4000, `--recend '\\n' --recstart '('`, `${treebridge} to-deps ${options} --first-number '{= $_=($job->seq()-1)*4000+1 =}' -`), input);
    const sentences = whole.split('\n\n').length - 1;
    console.log(`IcePaHC: ${sentences} sentences, ${Math.ceil(36946 / 4000)} pieces of 4,000 trees; identical: ${split === whole}`);
    expect(sentences).toBeGreaterThan(30_000);
    expect(split === whole).toBe(true);
  });

  it('numbers GUM trees without identifiers across pieces as the whole does', () => {
    const input = joined('gum.ptb', corpusFiles('gum/const', '.ptb'));
    const options = '--heads en-content --labels en-ud --pos-map en-ptb --id-prefix gum- --jobs 1 --quiet';
    const whole = shell(`${treebridge} to-deps ${options} -`, input);
    const split = shell(pieces(1000, `--recend '\\n' --recstart '('`, `${treebridge} to-deps ${options} --first-number '{= $_=($job->seq()-1)*1000+1 =}' -`), input);
    expect(whole).toContain('# sent_id = gum-11799\n');
    expect(split === whole).toBe(true);
  });

  it('rebuilds GUM dependencies piece by piece into the bracketings of the whole, byte for byte', () => {
    const input = joined('gum.conllu', corpusFiles('gum/dep', '.conllu'));
    const whole = shell(`${treebridge} to-brackets --quiet -`, input);
    const split = shell(pieces(1000, `--recend '\\n\\n'`, `${treebridge} to-brackets --quiet -`), input);
    expect(whole.split('\n').length).toBeGreaterThan(10_000);
    expect(split === whole).toBe(true);
  });
});

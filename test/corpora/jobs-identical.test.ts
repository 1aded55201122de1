// --jobs N writes what --jobs 1 writes, byte for byte, problems and closing line included, on all
// shared corpora: IcePaHC (CC BY 4.0) and GUM constituency trees (CC BY 4.0) for to-deps, rewrite,
// stats, validate and roundtrip of constituency trees; the UD version of IcePaHC (CC BY-SA 4.0) and GUM's dependencies
// for validate, stats, to-brackets and roundtrip of CoNLL-U.
import { describe, expect, it } from 'vitest';
import { runBin } from '../support/bin.js';
import { corpusFiles } from '../support/corpora.js';

const corpora = [
  ['IcePaHC', () => corpusFiles('icepahc', '.psd'), ['--lemmas']],
  ['GUM', () => corpusFiles('gum/const', '.ptb'), []],
] as const;

const commands = [
  ['to-deps', (name: string) => (name === 'IcePaHC' ? ['--heads', 'penn-historical', '--labels', 'penn-historical', '--pos-map', 'penn-historical'] : ['--heads', 'en-content', '--labels', 'en-ud', '--pos-map', 'en-ptb'])],
  ['rewrite', () => ['--traces', 'resolve']],
  ['stats', (name: string) => ['--arcs', '--traces', 'resolve', '--heads', name === 'IcePaHC' ? 'penn-historical' : 'en-content']],
  ['validate', () => ['--source']],
  ['roundtrip', (name: string) => (name === 'IcePaHC' ? ['--heads', 'penn-historical', '--labels', 'penn-historical'] : ['--heads', 'en-content', '--labels', 'en-ud'])],
] as const;

describe('worker threads on the shared corpora', () => {
  for (const [name, files, read] of corpora) {
    for (const [command, options] of commands) {
      it(`${command} of ${name}: --jobs 3 gives the bytes of --jobs 1`, async () => {
        // validate lists every problem already; the others are asked to.
        const args = [command, ...options(name), ...read, ...(command === 'validate' ? [] : ['--verbose']), ...files()];
        const one = await runBin([...args, '--jobs', '1'], { limitMs: 300_000 });
        const three = await runBin([...args, '--jobs', '3'], { limitMs: 300_000 });
        expect(one.stdout.length).toBeGreaterThan(command === 'stats' || command === 'roundtrip' ? 500 : command === 'validate' ? 40 : 1_000_000);
        expect(three.code).toBe(one.code);
        expect(three.stderr).toBe(one.stderr);
        expect(three.stdout === one.stdout).toBe(true);
      });
    }
  }
});

const dependencyCorpora = [
  ['IcePaHC UD', () => corpusFiles('icepahc-ud', '.conllu')],
  ['GUM dependencies', () => corpusFiles('gum/dep', '.conllu')],
] as const;

const dependencyCommands = [
  ['validate', ['--source']],
  ['stats', ['--arcs', '--verbose']],
  ['to-brackets', ['--lifts', '--verbose']],
  ['roundtrip', ['--verbose']],
] as const;

describe('worker threads on the shared CoNLL-U', () => {
  for (const [name, files] of dependencyCorpora) {
    for (const [command, options] of dependencyCommands) {
      it(`${command} of ${name}: --jobs 3 gives the bytes of --jobs 1`, async () => {
        const args = [command, ...options, ...files()];
        const one = await runBin([...args, '--jobs', '1'], { limitMs: 300_000 });
        const three = await runBin([...args, '--jobs', '3'], { limitMs: 300_000 });
        expect(one.stdout.length + one.stderr.length).toBeGreaterThan(command === 'roundtrip' ? 500 : 1_000);
        expect(three.code).toBe(one.code);
        expect(three.stderr).toBe(one.stderr);
        expect(three.stdout === one.stdout).toBe(true);
      });
    }
  }
});

// heads score: GUM constituency trees against GUM's dependencies, IcePaHC against its UD version
// (CC BY-SA 4.0), pairs converted and scored on threads and added up in order.
const scoredCorpora = [
  ['GUM', () => corpusFiles('gum/const', '.ptb'), () => corpusFiles('gum/dep', '.conllu'), ['--heads', 'en-content', '--labels', 'en-ud', '--pos-map', 'en-ptb']],
  [
    'IcePaHC',
    () => corpusFiles('icepahc', '.psd'),
    () => corpusFiles('icepahc-ud', '.conllu'),
    ['--heads', 'penn-historical', '--labels', 'penn-historical', '--pos-map', 'penn-historical', '--lemmas', '--unscored', 'Align=absorbed,extra'],
  ],
] as const;

describe('heads score on worker threads, on the shared corpora', () => {
  for (const [name, trees, gold, options] of scoredCorpora) {
    it(`heads score of ${name}: --jobs 3 gives the bytes of --jobs 1`, async () => {
      for (const extra of [['--verbose'], ['--json']]) {
        const args = ['heads', 'score', ...trees(), '--gold', ...gold(), ...options, ...extra];
        const one = await runBin([...args, '--jobs', '1'], { limitMs: 300_000 });
        const three = await runBin([...args, '--jobs', '3'], { limitMs: 300_000 });
        expect(one.stdout).toMatch(/UAS 9\d\.\d\d%|"uas": 0\.9/);
        expect(three.code).toBe(one.code);
        expect(three.stderr).toBe(one.stderr);
        expect(three.stdout === one.stdout).toBe(true);
      }
    });
  }
});

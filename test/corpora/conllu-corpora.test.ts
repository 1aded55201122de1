// The shared CoNLL-U files: GUM dep (CC BY 4.0), UD English EWT dev and UD Czech
// CAC dev (CC BY-SA 4.0), from ../shared/corpora. Sentence and word counts of the
// UD files from CHECK-VALUES §4; GUM's from the corpora README.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Diagnostic } from '../../src/diagnostics/diagnostic.js';
import { readConlluFile } from '../../src/formats/conllu/read-conllu.js';
import { writeSentence } from '../../src/formats/conllu/write-conllu.js';
import { cli } from '../support/cli.js';
import { corpusFiles } from '../support/corpora.js';

const files = () => [...corpusFiles('gum/dep', '.conllu'), ...corpusFiles('ud', '.conllu')];

describe('CoNLL-U on the shared corpora', () => {
  it('reads and writes back every file byte for byte', async () => {
    for (const file of files()) {
      const problems: Diagnostic[] = [];
      let written = '';
      for await (const sentence of readConlluFile(file, {}, (d) => problems.push(d))) written += writeSentence(sentence);
      expect(problems, file).toEqual([]);
      expect(written === readFileSync(file, 'utf8'), file).toBe(true);
    }
  });

  it.each([
    ['gum/dep', 11_799, 205_529],
    ['ud', 603 + 2_001, 10_912 + 25_147],
  ])('validate --json finds no error in %s, with every sentence and word counted', async (folder, sentences, words) => {
    const { code, stdout } = await cli(['validate', '--json', ...corpusFiles(folder, '.conllu')]);
    const report = JSON.parse(stdout);
    expect({ code, errors: report.errors, sentences: report.sentences, words: report.words }).toEqual({ code: 0, errors: 0, sentences, words });
  });
});

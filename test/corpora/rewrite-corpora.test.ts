// Writing the shared corpora (GUM CC BY 4.0, IcePaHC CC BY 4.0) in both
// layouts and reading them back gives the same trees; NLTK's tree reader
// (Debian python3-nltk, reference library) reads what we wrote as it read the originals.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Diagnostic } from '../../src/diagnostics/diagnostic.js';
import { readBracketedFile, readBracketedText } from '../../src/formats/bracketed/read-bracketed.js';
import { writeTree } from '../../src/traces/write-tree.js';
import { corpusFiles, nltkOutlines } from '../support/corpora.js';
import { outline } from '../support/tree-outline.js';

describe.each([
  ['GUM constituency trees', 'gum/const', '.ptb'],
  ['IcePaHC', 'icepahc', '.psd'],
])('rewriting %s', (_name, folder, extension) => {
  it.each(['line', 'indented'] as const)('in the %s layout reads back tree for tree, by us and by NLTK', async (layout) => {
    const files = corpusFiles(folder, extension);
    const dir = mkdtempSync(join(tmpdir(), 'treebridge-rewrite-'));
    const original: string[] = [];
    const written: string[] = [];
    for (const file of files) {
      const fail = (d: Diagnostic) => {
        if (d.severity === 'error') expect.fail(JSON.stringify(d));
      };
      let text = '';
      for await (const tree of readBracketedFile(file, { splitLemmas: extension === '.psd' }, fail)) {
        original.push(JSON.stringify(outline(tree)));
        text += writeTree(tree, { layout });
      }
      const path = join(dir, `${written.length}-${file.split('/').pop()}`);
      writeFileSync(path, text);
      written.push(path);
      const again = readBracketedText(text, { splitLemmas: extension === '.psd' }, fail).map((tree) => JSON.stringify(outline(tree)));
      expect(again).toEqual(original.slice(original.length - again.length));
    }
    const nltk = nltkOutlines(written);
    expect(nltk.length).toBe(original.length);
    const firstDifference = nltk.findIndex((line, i) => line !== original[i]);
    expect(firstDifference).toBe(-1);
  });
});

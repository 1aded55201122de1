// Outside check: NLTK's tree reader (Debian python3-nltk, a reference library
// nobody here wrote) reads the same trees, leaves and labels, tree by tree.
// Corpora: GUM (CC BY 4.0) and IcePaHC (CC BY 4.0) in ../shared/corpora.
import { describe, expect, it } from 'vitest';
import type { Diagnostic } from '../../src/diagnostics/diagnostic.js';
import { readBracketedFile } from '../../src/formats/bracketed/read-bracketed.js';
import { corpusFiles, nltkOutlines } from '../support/corpora.js';
import { outline } from '../support/tree-outline.js';

async function ourOutlines(files: string[], problems: Diagnostic[]): Promise<string[]> {
  const lines: string[] = [];
  for (const file of files) {
    for await (const tree of readBracketedFile(file, {}, (d) => problems.push(d))) lines.push(JSON.stringify(outline(tree)));
  }
  return lines;
}

describe.each([
  ['GUM constituency trees', 'gum/const', '.ptb', 11_799],
  ['IcePaHC', 'icepahc', '.psd', 36_946],
])('the reader on %s', (_name, folder, extension, expectedTrees) => {
  it('reads every tree without error and agrees with NLTK tree by tree', async () => {
    const files = corpusFiles(folder, extension);
    const problems: Diagnostic[] = [];
    const ours = await ourOutlines(files, problems);
    const theirs = nltkOutlines(files);
    expect(problems.filter((p) => p.severity === 'error')).toEqual([]);
    expect(ours.length).toBe(expectedTrees);
    expect(theirs.length).toBe(expectedTrees);
    const firstDifference = ours.findIndex((line, i) => line !== theirs[i]);
    expect(firstDifference === -1 ? null : { tree: firstDifference, ours: ours[firstDifference], nltk: theirs[firstDifference] }).toBeNull();
  });
});

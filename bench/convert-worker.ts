// Converts bracketed files to CoNLL-U as `treebridge to-deps` does (read,
// convert, write; the output goes to the null device) and prints trees,
// words, seconds and peak memory as JSON. Argument 1 is the head table.
import { closeSync, openSync, writeSync } from 'node:fs';
import { devNull } from 'node:os';
import { basename } from 'node:path';
import { convertTree, type ConversionSettings } from '../src/convert/convert-tree.js';
import { readBracketedFilesBatches } from '../src/formats/bracketed/read-bracketed.js';
import { writeSentence } from '../src/formats/conllu/write-conllu.js';
import { loadHeadTable } from '../src/tables/load-table.js';

const [heads, ...files] = process.argv.slice(2);
const settings: ConversionSettings = { heads: loadHeadTable(heads!), traces: 'keep', coordination: 'first', punctuation: 'phrase' };
const out = openSync(devNull, 'w');
let trees = 0;
let words = 0;
const started = process.hrtime.bigint();
for await (const batch of readBracketedFilesBatches(files, { splitLemmas: true }, () => undefined)) {
  let text = '';
  for (const tree of batch.trees) {
    trees++;
    const conversion = convertTree(tree, settings, tree.id ?? String(trees), `${basename(batch.file)}#${trees}`);
    if (!conversion) continue;
    words += conversion.words.length;
    text += writeSentence(conversion.sentence);
  }
  writeSync(out, text);
}
closeSync(out);
const seconds = Number(process.hrtime.bigint() - started) / 1e9;
process.stdout.write(JSON.stringify({ trees, words, seconds, peakMB: process.resourceUsage().maxRSS / 1024 }) + '\n');

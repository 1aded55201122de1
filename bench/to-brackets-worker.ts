// Rebuilds bracketings from CoNLL-U files as `treebridge to-brackets` does (read,
// build, write to the null device); prints sentences, words, seconds and peak memory as JSON.
import { closeSync, openSync, writeSync } from 'node:fs';
import { devNull } from 'node:os';
import { writeTree } from '../src/traces/write-tree.js';
import { readConlluFile } from '../src/formats/conllu/read-conllu.js';
import { buildBrackets } from '../src/reverse/build-brackets.js';
import { loadCategoryTable } from '../src/tables/load-category-table.js';

const files = process.argv.slice(2);
const settings = { categories: loadCategoryTable('ud'), shape: 'flat' as const, pos: 'upos' as const };
const out = openSync(devNull, 'w');
let trees = 0;
let words = 0;
const started = process.hrtime.bigint();
for (const file of files) {
  let text = '';
  for await (const sentence of readConlluFile(file, {}, () => undefined)) {
    const result = buildBrackets(sentence, settings);
    if (!result) continue;
    trees++;
    words += sentence.lines.filter((l) => l.type === 'word').length;
    text += writeTree(result.tree);
  }
  writeSync(out, text);
}
closeSync(out);
const seconds = Number(process.hrtime.bigint() - started) / 1e9;
process.stdout.write(JSON.stringify({ trees, words, seconds, peakMB: process.resourceUsage().maxRSS / 1024 }) + '\n');

// Reads CoNLL-U files and measures the structure of every sentence, as
// `treebridge stats` does; prints sentences, words, seconds and peak memory as JSON.
import { CorpusStructureCounter } from '../src/analysis/corpus-structure.js';
import { headVector } from '../src/analysis/heads.js';
import { analyseTree } from '../src/analysis/structure.js';
import { readConlluFile } from '../src/formats/conllu/read-conllu.js';

const files = process.argv.slice(2);
const counter = new CorpusStructureCounter();
let problems = 0;
const started = process.hrtime.bigint();
for (const file of files) {
  for await (const sentence of readConlluFile(file, {}, () => problems++)) {
    const heads = headVector(sentence);
    if (heads) counter.add(analyseTree(heads));
  }
}
const seconds = Number(process.hrtime.bigint() - started) / 1e9;
const { sentences, words } = counter.result();
process.stdout.write(JSON.stringify({ trees: sentences, words, problems, seconds, peakMB: process.resourceUsage().maxRSS / 1024 }) + '\n');

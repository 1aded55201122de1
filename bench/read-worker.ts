// Reads bracketed files with treebridge's streaming reader and prints what it
// measured as JSON: trees, words, problems, seconds spent reading, peak memory.
// Run in a process of its own so that its peak memory is its own.
import { readBracketedFilesBatches } from '../src/formats/bracketed/read-bracketed.js';
import type { ConstituentNode } from '../src/model/constituency.js';

/** Words under a node, counted without building a list (the reference side counts leaves the same way). */
function countWords(nodes: ConstituentNode[]): number {
  let words = 0;
  for (const node of nodes) {
    if (node.type === 'preterminal') words++;
    else if (node.type === 'phrase') words += countWords(node.children);
  }
  return words;
}

const files = process.argv.slice(2);
let trees = 0;
let words = 0;
let problems = 0;
const started = process.hrtime.bigint();
for await (const batch of readBracketedFilesBatches(files, {}, () => problems++)) {
  for (const tree of batch.trees) {
    trees++;
    words += countWords(tree.children);
  }
}
const seconds = Number(process.hrtime.bigint() - started) / 1e9;
process.stdout.write(JSON.stringify({ trees, words, problems, seconds, peakMB: process.resourceUsage().maxRSS / 1024 }) + '\n');

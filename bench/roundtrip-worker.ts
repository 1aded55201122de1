// Round-trips bracketed files as `treebridge roundtrip` does (brackets → dependencies
// → brackets, scored); argument 1 is the head table. Prints trees, seconds and peak memory as JSON.
import { BracketRoundTrip } from '../src/evaluate/roundtrip.js';
import { readBracketedFilesBatches } from '../src/formats/bracketed/read-bracketed.js';
import { loadCategoryTable } from '../src/tables/load-category-table.js';
import { loadHeadTable } from '../src/tables/load-table.js';

const [heads, ...files] = process.argv.slice(2);
const trip = new BracketRoundTrip(
  { heads: loadHeadTable(heads!), traces: 'keep', coordination: 'first', punctuation: 'phrase' },
  { categories: loadCategoryTable('ud'), shape: 'flat', pos: 'xpos' },
);
let trees = 0;
const started = process.hrtime.bigint();
for await (const batch of readBracketedFilesBatches(files, { splitLemmas: true }, () => undefined)) {
  for (const tree of batch.trees) trip.add(tree, tree.id ?? String(++trees));
}
const seconds = Number(process.hrtime.bigint() - started) / 1e9;
const report = trip.report();
process.stdout.write(JSON.stringify({ trees: report.sentences, seconds, peakMB: process.resourceUsage().maxRSS / 1024 }) + '\n');

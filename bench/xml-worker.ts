// The XML graph encoding, measured in a process of its own:
// - `write OUT FILES…`: reads bracketed files (lemmas split), resolves traces and
//   writes one XML document to OUT; the time counted is that of resolving and
//   writing, not of reading the bracketed input;
// - `read FILE`: reads an XML document into trees, all of it counted.
// Prints trees, words, seconds and peak memory as JSON.
import { closeSync, openSync, writeSync } from 'node:fs';
import { resolveTraces } from '../src/traces/resolve-traces.js';
import { readBracketedFileBatches } from '../src/formats/bracketed/read-bracketed.js';
import { readXmlGraphFile } from '../src/formats/xml-graph/read-xml-graph.js';
import { writeXmlSentence, xmlDocumentEnd, xmlDocumentStart } from '../src/formats/xml-graph/write-xml-graph.js';
import { preterminalsOf } from '../src/model/traverse.js';

const [mode, ...rest] = process.argv.slice(2);
let trees = 0;
let words = 0;
let seconds = 0;
if (mode === 'write') {
  const [target, ...files] = rest;
  const out = openSync(target!, 'w');
  writeSync(out, xmlDocumentStart());
  for (const file of files) {
    for await (const batch of readBracketedFileBatches(file, { splitLemmas: true }, () => undefined)) {
      const started = process.hrtime.bigint();
      let text = '';
      for (const tree of batch) {
        trees++;
        text += writeXmlSentence(resolveTraces(tree).tree, trees);
      }
      writeSync(out, text);
      seconds += Number(process.hrtime.bigint() - started) / 1e9;
      for (const tree of batch) words += preterminalsOf(tree).length;
    }
  }
  writeSync(out, xmlDocumentEnd());
  closeSync(out);
} else if (mode === 'read') {
  const started = process.hrtime.bigint();
  for await (const tree of readXmlGraphFile(rest[0]!, {}, () => undefined)) {
    trees++;
    words += preterminalsOf(tree).length;
  }
  seconds = Number(process.hrtime.bigint() - started) / 1e9;
} else throw new Error('usage: xml-worker write OUT FILES… | read FILE');
process.stdout.write(JSON.stringify({ trees, words, seconds, peakMB: process.resourceUsage().maxRSS / 1024 }) + '\n');

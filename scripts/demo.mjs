#!/usr/bin/env node
// npm run demo: treebridge on the invented sentences in demo-data/, step by step.
// Outputs go to demo-output/ (not tracked). Exits non-zero if a step does not behave as expected.
import { spawnSync } from 'node:child_process';
import { mkdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const bin = join(root, 'dist/src/bin/treebridge.js');
mkdirSync(join(root, 'demo-output'), { recursive: true });

const steps = [
  {
    say: 'Check the two clean demo files: every tree is read, no problem is found.',
    args: ['validate', 'demo-data/harbour.psd', 'demo-data/ferry-log.psd'],
    expect: 0,
  },
  {
    say: 'Check a file of deliberately broken trees: each problem at its line and column, the good trees still read.',
    args: ['validate', '--source', 'demo-data/broken.psd'],
    expect: 1,
  },
  {
    say: 'Split the word-lemma leaves of the historical-style file and write it in the indented layout.',
    args: ['rewrite', '--lemmas', '--layout', 'indented', '-o', 'demo-output/ferry-log.indented.psd', 'demo-data/ferry-log.psd'],
    expect: 0,
  },
  {
    say: 'Write the harbour trees one per line, then check the result reads back the same.',
    args: ['rewrite', '-o', 'demo-output/harbour.line.psd', 'demo-data/harbour.psd'],
    expect: 0,
  },
  {
    say: 'The same counts as the original: 25 trees, 216 words.',
    args: ['validate', 'demo-output/harbour.line.psd'],
    expect: 0,
  },
  {
    say: 'The main job: convert the harbour trees to Universal Dependencies, with content heads and UD relations.',
    args: ['to-deps', '--heads', 'en-content', '--labels', 'en-ud', '--pos-map', 'en-ptb', '-o', 'demo-output/harbour.conllu', 'demo-data/harbour.psd'],
    expect: 0,
  },
  {
    say: 'The converted file passes the CoNLL-U checks.',
    args: ['validate', 'demo-output/harbour.conllu'],
    expect: 0,
  },
  {
    say: 'Why did a phrase get its head? The steps of the table, phrase by phrase, for the fourth tree.',
    args: ['heads', 'explain', '--heads', 'en-content', '--sentence', '4', 'demo-data/harbour.psd'],
    expect: 0,
  },
  {
    say: 'Restoring traces puts the extraposed and topicalised phrases where their traces stand: some arcs now cross.',
    args: ['stats', '--arcs', '--heads', 'en-content', '--traces', 'resolve', 'demo-data/harbour.psd'],
    expect: 0,
  },
  {
    say: 'The way back: a dependency tree with a crossing arc becomes a bracketing, the arc lifted and marked with an *ICH* trace.',
    args: ['to-brackets', '--lifts', '--layout', 'indented', 'demo-data/crossing.conllu'],
    expect: 0,
  },
  {
    say: 'The historical-style file, with its word-lemma leaves, converted with the historical head table and POS map.',
    args: ['to-deps', '--heads', 'penn-historical', '--pos-map', 'penn-historical', '--lemmas', '-o', 'demo-output/ferry-log.conllu', 'demo-data/ferry-log.psd'],
    expect: 0,
  },
  {
    say: 'What a conversion loses: there and back, a loss table, and a page drawing the sentences with losses.',
    args: ['roundtrip', '--heads', 'en-content', '--pos-map', 'en-ptb', '--examples', '3', '--report', 'demo-output/harbour-losses.html', 'demo-data/harbour.psd'],
    expect: 0,
  },
  {
    say: 'Tuning a head table: the function-head table scored against the demo gold (content heads), with a page linking each kind of error to the sentences drawn with the wrong choices marked.',
    args: ['heads', 'score', '--heads', 'en-function', '--labels', 'en-ud', 'demo-data/harbour.psd', '--gold', 'demo-data/harbour-gold.conllu', '--report', 'demo-output/harbour-tuning.html'],
    expect: 0,
  },
  {
    say: 'Lossless mode: the whole bracketing rides in MISC, so the way back is exact.',
    args: ['roundtrip', '--lossless', '--heads', 'en-content', 'demo-data/harbour.psd'],
    expect: 0,
  },
  {
    say: 'Traces resolved: each antecedent becomes a discontinuous child where its trace stood, written in the XML graph encoding.',
    args: ['rewrite', '--traces', 'resolve', '-o', 'demo-output/harbour.xml', 'demo-data/harbour.psd'],
    expect: 0,
  },
  {
    say: 'The XML graphs convert without traces to the same dependencies as restoring traces in the bracketing.',
    args: ['to-deps', '--heads', 'en-content', '--labels', 'en-ud', '--pos-map', 'en-ptb', '-o', 'demo-output/harbour-from-xml.conllu', 'demo-output/harbour.xml'],
    expect: 0,
  },
  {
    say: 'The crossing dependency tree as an XML graph: the non-projective subtree is one discontinuous phrase, nothing lifted.',
    args: ['to-brackets', '--to', 'xml', 'demo-data/crossing.conllu'],
    expect: 0,
  },
  {
    say: 'And an XML graph back to a bracketing: the discontinuous phrase is cut, an *ICH* trace marks where its part belongs.',
    args: ['rewrite', 'demo-data/ferry-graphs.xml'],
    expect: 0,
  },
];

let failed = false;
for (const [number, step] of steps.entries()) {
  console.log(`\n${number + 1}. ${step.say}\n$ treebridge ${step.args.join(' ')}`);
  const run = spawnSync(process.execPath, [bin, ...step.args], { cwd: root, encoding: 'utf8' });
  process.stdout.write(run.stdout);
  process.stdout.write(run.stderr);
  console.log(`(exit ${run.status})`);
  if (run.status !== step.expect) {
    console.log(`   expected exit ${step.expect}`);
    failed = true;
  }
}
console.log(failed ? '\nThe demo did not go as expected.' : '\nDemo done; written files are in demo-output/.');
process.exitCode = failed ? 1 : 0;

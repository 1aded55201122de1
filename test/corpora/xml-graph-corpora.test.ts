// The XML graph encoding on real corpora, with outside checks:
// - Python's standard xml.etree.ElementTree (a reference library) parses every
//   file we write, and test/support/xml-graph-check.py verifies each graph: one
//   root, every edge target exists, every terminal reached exactly once, no cycles.
// - IcePaHC (CC BY 4.0): bracketed → traces resolved into discontinuous phrases →
//   XML → read back → to-deps gives, tree for tree, the dependencies that
//   `to-deps --traces resolve` gives on the bracketing.
// - UD EWT and CAC dev (CC BY-SA 4.0) and GUM dep (CC BY 4.0): dependencies → XML
//   (non-projective subtrees as discontinuous phrases) → `to-deps --heads ud` is
//   exact for every sentence, and the number of discontinuous phrases equals the
//   number of words of gap degree ≥ 1 (Kuhlmann & Nivre 2006) that `stats` counts.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { resolveTraces } from '../../src/traces/resolve-traces.js';
import { readBracketedFile } from '../../src/formats/bracketed/read-bracketed.js';
import { readConlluText } from '../../src/formats/conllu/read-conllu.js';
import { cli } from '../support/cli.js';
import { corpusFiles, projectRoot, python } from '../support/corpora.js';

interface GraphCheck {
  sentences: number;
  terminals: number;
  nonterminals: number;
  discontinuous: number;
  problems: number;
  examples: string[];
}

function checkWithElementTree(file: string): GraphCheck {
  const script = join(projectRoot, 'test/support/xml-graph-check.py');
  return JSON.parse(execFileSync(python, [script, file], { encoding: 'utf8', maxBuffer: 1 << 26 }));
}

/** The `# sent_id` of every sentence. */
function sentIds(text: string): string[] {
  return readConlluText(text, {}, () => undefined).map((s) => s.id ?? '');
}

/** Per sentence: the words' ids, forms, heads and relations. */
function arcs(text: string): string[] {
  return readConlluText(text, {}, () => undefined).map((s) =>
    s.lines.filter((l) => l.type === 'word').map((l) => `${l.id}:${l.form}:${l.head}:${l.deprel}`).join(' '),
  );
}

describe('IcePaHC through the XML graph encoding', () => {
  it('converts to the same dependencies as restoring traces in the bracketing, tree for tree', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'treebridge-xml-'));
    const files = corpusFiles('icepahc', '.psd');
    const xml = join(dir, 'icepahc.xml');
    const written = await cli(['rewrite', '--lemmas', '--traces', 'resolve', '-o', xml, ...files]);
    expect(written.code).toBe(0);
    const [, read, out, moved] = /([\d,]+) trees read: ([\d,]+) written, 0 skipped; ([\d,]+) antecedents moved/.exec(written.stderr)!;
    expect(out).toBe(read);

    const check = checkWithElementTree(xml);
    expect(check.examples).toEqual([]);
    expect(check.sentences).toBe(Number(read!.replace(/,/g, '')));

    const viaXml = join(dir, 'via-xml.conllu');
    const restored = join(dir, 'restored.conllu');
    expect((await cli(['to-deps', '--heads', 'penn-historical', '-o', viaXml, xml])).code).toBe(0);
    expect((await cli(['to-deps', '--lemmas', '--heads', 'penn-historical', '--traces', 'resolve', '-o', restored, ...files])).code).toBe(0);
    const a = arcs(readFileSync(viaXml, 'utf8'));
    const b = arcs(readFileSync(restored, 'utf8'));
    expect(a.length).toBe(b.length);
    const differing = a.filter((sentence, i) => sentence !== b[i]).length;
    console.log(`IcePaHC: ${read} trees, ${moved} antecedents moved, ${check.discontinuous} discontinuous phrases; ${a.length} sentences converted, ${differing} differ`);
    expect(differing).toBe(0);
    expect(a.length).toBe(36_555);

    // The opposite way: the discontinuous trees written as bracketings with *ICH* traces, read with
    // --traces resolve, give the same dependencies again.
    const bracketed = join(dir, 'back.psd');
    const rewritten = await cli(['rewrite', '-o', bracketed, xml]);
    expect(rewritten.code).toBe(0);
    const inserted = Number(/([\d,]+) \*ICH\* traces? put in/.exec(rewritten.stderr)![1]!.replace(/,/g, ''));
    const viaTraces = join(dir, 'via-traces.conllu');
    expect((await cli(['to-deps', '--lemmas', '--heads', 'penn-historical', '--traces', 'resolve', '-o', viaTraces, bracketed])).code).toBe(0);
    const c = arcs(readFileSync(viaTraces, 'utf8'));
    expect(c.length).toBe(b.length);
    // A trace left behind because its antecedent had moved to an earlier trace is not stable: in the
    // rebuilt bracketing it may take another phrase. Every other sentence must come back the same.
    const unstable = new Set<string>();
    for (const file of files) {
      for await (const tree of readBracketedFile(file, { splitLemmas: true }, () => undefined)) {
        if (tree.id !== undefined && resolveTraces(tree).leftover > 0) unstable.add(tree.id);
      }
    }
    const ids = sentIds(readFileSync(restored, 'utf8'));
    const differingIds = ids.filter((_, i) => c[i] !== b[i]);
    console.log(
      `IcePaHC back to bracketings: ${inserted} *ICH* traces put in; ${c.length} sentences converted, ${differingIds.length} differ, ` +
        `all among the ${unstable.size} trees with traces left behind: ${differingIds.every((id) => unstable.has(id))}`,
    );
    expect(differingIds.filter((id) => !unstable.has(id))).toEqual([]);
    expect(c.length - unstable.size).toBeGreaterThan(36_000);
  });
});

describe.each([
  ['IcePaHC', 'icepahc', '.psd', ['--lemmas']],
  ['GUM', 'gum/const', '.ptb', []],
])('%s bracketings through the XML graph encoding, traces kept', (_name, folder, extension, options) => {
  it('come back byte for byte as rewrite writes them, and validate without errors', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'treebridge-xml-'));
    const files = corpusFiles(folder, extension);
    const xml = join(dir, 'plain.xml');
    expect((await cli(['rewrite', ...options, '-o', xml, ...files])).code).toBe(0);
    const check = checkWithElementTree(xml);
    expect(check.examples).toEqual([]);
    const validated = JSON.parse((await cli(['validate', '--json', xml])).stdout);
    expect(validated.errors).toBe(0);
    const back = await cli(['rewrite', xml]);
    const direct = await cli(['rewrite', ...options, ...files]);
    expect(back.code).toBe(0);
    const a = back.stdout.split('\n');
    const b = direct.stdout.split('\n');
    expect(a.length).toBe(b.length);
    const differing = a.filter((line, i) => line !== b[i]).length;
    console.log(`${folder}: ${check.sentences} trees through XML and back, ${differing} lines differ; validate: ${validated.errors} errors, ${validated.warnings} warnings`);
    expect(differing).toBe(0);
  });
});

describe.each([
  ['UD', 'ud'],
  ['GUM', 'gum/dep'],
])('the %s dependency files through the XML graph encoding', (_name, folder) => {
  it('come back with the same heads and relations, one discontinuous phrase per gapped word', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'treebridge-xml-'));
    const files = corpusFiles(folder, '.conllu');
    const xml = join(dir, 'graphs.xml');
    const built = await cli(['to-brackets', '--to', 'xml', '-o', xml, ...files]);
    expect(built.code).toBe(0);
    const [, read, written, discontinuous] = /([\d,]+) sentences read: ([\d,]+) written, 0 skipped; ([\d,]+) discontinuous phrases?/.exec(built.stderr)!;
    expect(written).toBe(read);

    const check = checkWithElementTree(xml);
    expect(check.examples).toEqual([]);
    expect(check.sentences).toBe(Number(read!.replace(/,/g, '')));
    expect(check.discontinuous).toBe(Number(discontinuous!.replace(/,/g, '')));

    const stats = JSON.parse((await cli(['stats', '--json', ...files])).stdout);
    expect(Number(discontinuous!.replace(/,/g, ''))).toBe(stats.gappedWords);

    const back = join(dir, 'back.conllu');
    expect((await cli(['to-deps', '--heads', 'ud', '-o', back, xml])).code).toBe(0);
    const original = files.flatMap((file) => arcs(readFileSync(file, 'utf8')));
    const again = arcs(readFileSync(back, 'utf8'));
    expect(again.length).toBe(original.length);
    const differing = again.filter((sentence, i) => sentence !== original[i]).length;
    console.log(`${folder}: ${read} sentences, ${discontinuous} discontinuous phrases = ${stats.gappedWords} gapped words; ${differing} differ`);
    expect(differing).toBe(0);
  });
});

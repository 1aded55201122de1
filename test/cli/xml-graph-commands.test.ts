import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cli } from '../support/cli.js';
import { projectRoot } from '../support/corpora.js';

const harbour = join(projectRoot, 'demo-data/harbour.psd');
const crossing = join(projectRoot, 'demo-data/crossing.conllu');
const graphs = join(projectRoot, 'test/fixtures/xml-graph/ferry-graphs.xml');
const arcs = (conllu: string) => conllu.split('\n').filter((l) => /^\d/.test(l)).map((l) => l.split('\t').slice(0, 8).join(' '));

describe('the XML graph encoding on the command line', () => {
  it('rewrite --traces resolve writes XML by the output extension, and to-deps reads it to the same dependencies as --traces resolve', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'treebridge-xml-cli-'));
    const xml = join(dir, 'harbour.xml');
    const written = await cli(['rewrite', '--traces', 'resolve', '-o', xml, harbour]);
    expect(written.code).toBe(0);
    expect(written.stderr).toBe('treebridge: 25 trees read: 25 written, 0 skipped; 12 antecedents moved to their traces\n');
    expect(readFileSync(xml, 'utf8')).toMatch(/^<\?xml version="1.0" encoding="UTF-8"\?>\n<corpus>/);
    const viaXml = await cli(['to-deps', '--heads', 'en-function', xml]);
    const restored = await cli(['to-deps', '--heads', 'en-function', '--traces', 'resolve', harbour]);
    expect(viaXml.code).toBe(0);
    expect(arcs(viaXml.stdout)).toEqual(arcs(restored.stdout));
    expect(arcs(viaXml.stdout).length).toBe(216);
  });

  it('reads XML from standard input with --from xml', async () => {
    const result = await cli(['to-deps', '--heads', 'generic', '--from', 'xml', '-'], { stdin: readFileSync(graphs, 'utf8') });
    expect(result.code).toBe(0);
    expect(result.stdout).toContain('# sent_id = ferry.1');
    expect(result.stdout).toContain('# sent_id = ferry.2');
  });

  it('reports the secondary edges a dependency tree cannot hold', async () => {
    const result = await cli(['to-deps', '--heads', 'generic', graphs]);
    expect(result.code).toBe(0);
    expect(result.stderr).toMatch(/ferry-graphs\.xml:17:9: warning: sentence ferry\.1: 1 secondary edge \(OB\) left out of the dependency tree \[secondary-edges-dropped\]/);
  });

  it('to-brackets --to xml builds a discontinuous phrase instead of lifting, and to-deps --heads ud gives the sentence back', async () => {
    const built = await cli(['to-brackets', '--to', 'xml', crossing]);
    expect(built.code).toBe(0);
    expect(built.stderr).toBe('treebridge: 1 sentence read: 1 written, 0 skipped; 1 discontinuous phrase\n');
    const back = await cli(['to-deps', '--heads', 'ud', '--from', 'xml', '-'], { stdin: built.stdout });
    const heads = (text: string) => arcs(text).map((l) => l.split(' ').filter((_, i) => [0, 1, 6, 7].includes(i)).join(' '));
    expect(heads(back.stdout)).toEqual(heads(readFileSync(crossing, 'utf8')));
  });

  it('rewrites XML graphs as bracketings with *ICH* traces', async () => {
    const result = await cli(['rewrite', graphs]);
    expect(result.code).toBe(0);
    expect(result.stdout.split('\n')[0]).toBe('( (S (NP-SBJ (DT A-a) (NN ferry-ferry) (-NONE- *ICH*-1)) (VP (VBD arrived-arrive)) (SBAR-1 (WDT that-that) (NN-SBJ nobody-nobody) (VBD expected-expect)) (. .-.)) (ID ferry.1))');
    expect(result.stderr.split('\n').filter((line) => !line.includes('[xml-object-name]'))).toEqual([
      expect.stringMatching(/ferry-graphs\.xml:17:9: warning: sentence ferry\.1: 1 secondary edge \(OB\) left out of the bracketing \[secondary-edges-dropped\]$/),
      expect.stringMatching(/^treebridge: 2 trees read: 2 written, 0 skipped; 1 \*ICH\* trace put in for discontinuous phrases; 0 errors, \d+ warnings$/),
      '',
    ]);
  });

  it('validate, stats and roundtrip take XML input', async () => {
    expect((await cli(['validate', graphs])).stdout).toMatch(/\n1 file, 2 trees, 9 words: 0 errors, 5 warnings\n$/);
    const stats = JSON.parse((await cli(['stats', '--json', '--heads', 'generic', graphs])).stdout);
    expect([stats.sentences, stats.words]).toEqual([2, 9]);
    const trip = await cli(['roundtrip', '--json', '--heads', 'generic', graphs]);
    expect(trip.code).toBe(0);
    expect(JSON.parse(trip.stdout).sentences).toBe(2);
  });

  it('fails with exit code 1 and a position on broken XML', async () => {
    const result = await cli(['validate', '--from', 'xml', '-'], { stdin: '<corpus><body><s id="a"><graph root="x">\n<terminals><t id="x" word="a" pos="N"></terminals>' });
    expect(result.code).toBe(1);
    expect(result.stdout).toMatch(/^-:2:\d+: error: not well-formed XML/);
  });

  it('says so when a file read as XML is a bracketing', async () => {
    const result = await cli(['validate', '--source', '--from', 'xml', harbour]);
    expect(result.code).toBe(1);
    expect(result.stdout).toMatch(/harbour\.psd:1:1: error: not well-formed XML: non-whitespace before first tag/);
    expect(result.stdout).toMatch(/this looks like a bracketed file: read it with --from bracketed/);
  });

  it('reports a tree with a character XML cannot hold and writes the others', async () => {
    const result = await cli(['rewrite', '--to', 'xml', '-'], { stdin: '( (S (NN bad\u0001word)) (ID a))\n( (S (NN good)) (ID b))\n' });
    expect(result.code).toBe(1);
    expect(result.stderr).toMatch(/-:1:1: error: tree a cannot be written as XML: U\+0001 cannot be written in XML \[unwritable-tree\]/);
    expect(result.stdout).toContain('<s id="b">');
    expect(result.stdout.trimEnd().endsWith('</corpus>')).toBe(true);
  });
});

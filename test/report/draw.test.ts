import { describe, expect, it } from 'vitest';
import { drawBracketing, drawDependencies } from '../../src/report/draw.js';
import { writeReport } from '../../src/report/write-report.js';
import { BracketRoundTrip, DependencyRoundTrip } from '../../src/evaluate/roundtrip.js';
import { readConlluText } from '../../src/formats/conllu/read-conllu.js';
import { loadCategoryTable } from '../../src/tables/load-category-table.js';
import { loadHeadTable } from '../../src/tables/load-table.js';
import { read } from '../support/read.js';

const count = (svg: string, pattern: RegExp) => (svg.match(pattern) ?? []).length;

describe('drawings for the round-trip report', () => {
  it('draws one box per word and one arc per dependency, dashing the arcs that cross', () => {
    // Our own four words: 2 is the root; 1 and 3 hang from it; 4 hangs from 1 across 2 and 3.
    const svg = drawDependencies(['Gulls', 'circled', 'slowly', 'overhead'], ['NNS', 'VBD', 'RB', 'RB'], [2, 0, 2, 1], ['nsubj', 'root', 'advmod', 'advmod'], new Set([4]));
    expect(count(svg, /<rect class="word"/g)).toBe(4);
    expect(count(svg, /<path class="arc[" ]/g)).toBe(3);
    expect(count(svg, /<path class="arc crossing"/g)).toBe(1);
  });

  it('draws one bar per phrase over the words it spans, and marks the spans asked for', () => {
    const tree = read('(S (NP (DT The) (NN keeper)) (VP (VBD slept)))').trees[0]!;
    const svg = drawBracketing(tree, new Map([['0:2', 'lost']]));
    expect(count(svg, /<rect class="bar/g)).toBe(3);
    expect(count(svg, /<rect class="bar lost"/g)).toBe(1);
    expect(count(svg, /<rect class="word"/g)).toBe(3);
  });

  it('draws lost empty elements and traces in place when asked, the phrases over them alone marked empty, word spans unchanged', () => {
    const tree = read('(S (NP-SBJ (-NONE- *pro*)) (NP (DT The) (NN keeper)) (VP (VBD slept) (NP (-NONE- *T*-1))))').trees[0]!;
    const plain = drawBracketing(tree, new Map([['0:2', 'lost']]));
    expect(count(plain, /<rect class="word"/g)).toBe(3);
    const drawn = drawBracketing(tree, new Map([['0:2', 'lost']]), { empties: true });
    expect(count(drawn, /<rect class="word"/g)).toBe(3);
    expect(count(drawn, /<rect class="word empty"/g)).toBe(2);
    expect(drawn).toContain('>*pro*</text>');
    expect(drawn).toContain('>*T*-1</text>');
    // NP-SBJ and the object NP hold nothing but empty elements; "The keeper" keeps its word-span mark.
    expect(count(drawn, /<rect class="bar empty"/g)).toBe(2);
    expect(count(drawn, /<rect class="bar lost"/g)).toBe(1);
  });

  it('escapes every corpus string: a word like <script> is shown, never run', () => {
    const tree = read('(S (NP (SYM <script>alert(1)</script>)) (VP (VBD slept)))'.replace('alert(1)', 'alert')).trees[0]!;
    const svg = drawBracketing(tree);
    expect(svg).not.toContain('<script>');
    expect(svg).toContain('&lt;script&gt;');
  });

  it('makes one self-contained page: no outside stylesheet, script or image', () => {
    const trip = new BracketRoundTrip(
      { heads: loadHeadTable('en-content'), traces: 'keep', coordination: 'first', punctuation: 'phrase' },
      { categories: loadCategoryTable('ud'), shape: 'flat', pos: 'xpos' },
      5,
      2,
    );
    for (const tree of read('( (S (NP-SBJ (DT The) (NN keeper)) (VP (VBD slept)) (. .)) (ID a.1))').trees) trip.add(tree, tree.id!);
    const page = writeReport(trip.report(), trip.samples);
    expect(page.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(page).not.toMatch(/<link|<script|src=|@import|url\(http/);
    expect(count(page, /<section class="sentence">/g)).toBeGreaterThan(0);
  });

  it('draws a dependency round trip as the sentence there, the bracketing between and the sentence back, changed arcs marked', () => {
    // Our own sentence; with the left-headed generic table on the way back, "keeper" no longer heads "The".
    const text = ['# sent_id = b.1', '1\tThe\tthe\tDET\tDT\t_\t2\tdet\t_\t_', '2\tkeeper\tkeeper\tNOUN\tNN\t_\t3\tnsubj\t_\t_', '3\tslept\tsleep\tVERB\tVBD\t_\t0\troot\t_\t_', '', ''].join('\n');
    const [sentence] = readConlluText(text, { file: 'b.conllu' }, () => undefined);
    const trip = new DependencyRoundTrip(
      { categories: loadCategoryTable('ud'), shape: 'flat', pos: 'upos' },
      { heads: loadHeadTable('generic'), traces: 'resolve', coordination: 'first', punctuation: 'phrase' },
      5,
      3,
    );
    trip.add(sentence!, 'b.1');
    expect(trip.samples).toHaveLength(1);
    const changed = trip.samples[0]!.changed;
    expect(changed.size).toBeGreaterThan(0);
    const page = writeReport(trip.report(), trip.samples);
    expect(count(page, /<svg class="dependencies"/g)).toBe(2);
    expect(count(page, /<svg class="bracketing"/g)).toBe(1);
    // The root has no arc to draw; every other changed word has a marked one.
    const back = trip.samples[0]!.back.lines.filter((l) => l.type === 'word');
    const drawnChanged = back.filter((l) => changed.has(Number(l.id)) && l.head !== '0').length;
    expect(drawnChanged).toBeGreaterThan(0);
    expect(count(page, /<path class="arc[a-z ]* changed"/g)).toBe(drawnChanged);
  });

  it('shortens a label too long for its bar, keeping the whole label on hover and in a line under the drawing', () => {
    const tree = read('(S (NP-SBJ-LONGNAME (NN Fog)) (VP (VBD lifted)))').trees[0]!;
    const svg = drawBracketing(tree);
    expect(svg).toContain('<title>NP-SBJ-LONGNAME</title>');
    expect(svg).toMatch(/<text class="label"[^>]*>NP-…<\/text>|<text class="label"[^>]*>N[^<]*…<\/text>/);
    expect(svg).toContain('<p class="labels">shortened: NP-SBJ-LONGNAME</p>');
    expect(svg).not.toContain('textLength');
  });

  it('keeps the relation labels of arcs of the same height apart', () => {
    // Two arcs over one word each, side by side and touching: their labels would meet at the same height.
    const svg = drawDependencies(['a', 'b', 'c'], ['X', 'X', 'X'], [2, 0, 2], ['dependentlabel', 'root', 'otherlabel'], new Set());
    const labels = [...svg.matchAll(/<text class="relation" x="([\d.]+)" y="([\d.]+)">/g)].map((m) => ({ x: Number(m[1]), y: Number(m[2]) }));
    expect(labels).toHaveLength(2);
    const [first, second] = labels as [{ x: number; y: number }, { x: number; y: number }];
    const apart = Math.abs(first.x - second.x) > 6.5 * 14 || Math.abs(first.y - second.y) >= 11;
    expect(apart).toBe(true);
  });
});

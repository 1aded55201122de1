// What the conversion writes for each word: UD relations, UPOS and features from the word table,
// forms with the scheme's escapes undone, pieces of one written word under a multiword token, and
// never an empty element as a word. Invented sentences of the harbour scenario.
import { describe, expect, it } from 'vitest';
import { convertTree, type ConversionSettings } from '../../src/convert/convert-tree.js';
import { writeSentence } from '../../src/formats/conllu/write-conllu.js';
import { readConlluText } from '../../src/formats/conllu/read-conllu.js';
import { decodeBrackets } from '../../src/lossless/decode-brackets.js';
import { carryBrackets } from '../../src/lossless/carry-brackets.js';
import { writeTree } from '../../src/traces/write-tree.js';
import { loadHeadTable, loadLabelTable } from '../../src/tables/load-table.js';
import { loadPosMap } from '../../src/tables/load-pos-map.js';
import { validateConllu } from '../support/read.js';
import { read } from '../support/read.js';
import type { Tree } from '../../src/model/constituency.js';

const historical: ConversionSettings = {
  heads: loadHeadTable('penn-historical'),
  labels: loadLabelTable('penn-historical'),
  upos: loadPosMap('penn-historical'),
  traces: 'keep',
  coordination: 'first',
  punctuation: 'phrase',
};
const english: ConversionSettings = { heads: loadHeadTable('en-content'), labels: loadLabelTable('en-ud'), upos: loadPosMap('en-ptb'), traces: 'keep', coordination: 'first', punctuation: 'phrase' };

const tree = (text: string, lemmas = false): Tree => read(text, lemmas ? { splitLemmas: true } : {}).trees[0]!;
const columns = (text: string, settings: ConversionSettings, lemmas = false) => {
  const result = convertTree(tree(text, lemmas), settings, 't1', 't1')!;
  return result.sentence;
};

// An invented sentence in the style of the Penn-Helsinki historical corpora: "the keeper gave the
// boys the ropes in the harbour", with a clitic article joined to its noun (harbour$ $the).
const keeper =
  '( (IP-MAT (NP-SBJ (N-N keeper-keeper)) (VBDI gave-give) (NP-OB2 (NS-D boys-boy)) (NP-OB1 (NS-A ropes-rope))' +
  ' (PP (P in-in) (NP (N-D harbour$-harbour) (D-D $the-the))) (. .-.)) (ID keeper.1))';

describe('UD words from a historical-style tree', () => {
  it('gives UD relations from function tags and categories (penn-historical.labels)', () => {
    const words = columns(keeper, historical, true).lines.filter((l) => l.type === 'word');
    expect(words.map((w) => `${w.form}/${w.deprel}`)).toEqual(['keeper/nsubj', 'gave/root', 'boys/iobj', 'ropes/obj', 'in/case', 'harbour/obl', 'the/det', './punct']);
  });

  it('gives UPOS and features from the parts of the tags (penn-historical.pos)', () => {
    const words = columns(keeper, historical, true).lines.filter((l) => l.type === 'word');
    expect(words.map((w) => `${w.upos} ${w.feats}`)).toEqual([
      'NOUN Case=Nom|Number=Sing',
      'VERB Mood=Ind|Tense=Past|VerbForm=Fin',
      'NOUN Case=Dat|Number=Plur',
      'NOUN Case=Acc|Number=Plur',
      'ADP _',
      'NOUN Case=Dat|Number=Sing',
      'DET Case=Dat|PronType=Dem',
      'PUNCT _',
    ]);
  });

  it('keeps the pieces of one written word as words, under a multiword token with the written form', () => {
    const sentence = columns(keeper, historical, true);
    const text = writeSentence(sentence);
    expect(text).toContain('\n6-7\tharbourthe\t_\t_\t_\t_\t_\t_\t_\t_\n6\tharbour\tharbour\t');
    expect(text).toContain('# text = keeper gave boys ropes in harbourthe .\n');
    // What it writes is valid CoNLL-U (UD v2 format specification).
    expect(validateConllu(text).problems).toEqual([]);
  });

  it('never makes a word of an empty element, with or without a case suffix, under any tag', () => {
    const text = '( (IP-MAT (NP-SBJ *con*-D) (ADVP (ADV *ICH*-1)) (NUMP *T*-2) (NP-SBJ *pro*-A) (VBDI slept-sleep) (. .-.)) (ID keeper.2))';
    const words = columns(text, historical, true).lines.filter((l) => l.type === 'word');
    expect(words.map((w) => w.form)).toEqual(['slept', '.']);
  });
});

describe('UD words from a Penn-Treebank-style tree', () => {
  const harbour = '( (S (NP-SBJ (DT The) (NN keeper) (-LRB- -LRB-) (NN Mira) (-RRB- -RRB-)) (VP (VBD checked) (NP (NN item) (NN -LRB-a-RRB-))) (. .)) (ID h.1))';

  it('writes brackets as brackets in FORM, LEMMA and # text; XPOS keeps the tag', () => {
    const sentence = columns(harbour, english);
    const words = sentence.lines.filter((l) => l.type === 'word');
    expect(words.map((w) => w.form)).toEqual(['The', 'keeper', '(', 'Mira', ')', 'checked', 'item', '(a)', '.']);
    expect(words[2]!.xpos).toBe('-LRB-');
    expect(sentence.comments.find((c) => c.text.startsWith(' text'))!.text).toBe(' text = The keeper ( Mira ) checked item (a) .');
  });

  it('tells an auxiliary from a verb, and a complementiser from a preposition, by the relation', () => {
    const text = '( (S (NP-SBJ (DT The) (NN ferry)) (VP (VBD was) (ADJP-PRD (JJ late))) (SBAR-ADV (IN because) (S (NP-SBJ (NN fog)) (VP (VBD fell)))) (. .)) (ID h.2))';
    const words = columns(text, english).lines.filter((l) => l.type === 'word');
    expect(words.map((w) => `${w.form}/${w.upos}/${w.deprel}`)).toEqual(['The/DET/det', 'ferry/NOUN/nsubj', 'was/AUX/cop', 'late/ADJ/root', 'because/SCONJ/mark', 'fog/NOUN/nsubj', 'fell/VERB/advcl', './PUNCT/punct']);
  });

  it('gives the bracketing back byte for byte in lossless mode, escapes and joins undone', () => {
    for (const [text, settings, lemmas] of [
      [harbour, english, false],
      [keeper, historical, true],
    ] as const) {
      const original = tree(text, lemmas);
      const conversion = convertTree(original, settings, original.id!, 't')!;
      const sentence = carryBrackets(original, conversion, settings);
      const back = readConlluText(writeSentence(sentence), {}, () => undefined)[0]!;
      expect(writeTree(decodeBrackets(back) as Tree)).toBe(writeTree(original));
    }
  });
});

describe('forms in normalization form C', () => {
  it('composes a decomposed accent and leaves precomposed and plain forms as they are', () => {
    const sentence = columns('( (IP-MAT (NP-SBJ (N-N Cafe\u0301)) (VBDI opened) (. .)))', historical);
    const forms = sentence.lines.filter((line) => line.type === 'word').map((line) => line.form);
    expect(forms).toEqual(['Caf\u00e9', 'opened', '.']);
    const plain = columns('( (IP-MAT (NP-SBJ (N-N Þórður)) (VBDI sá) (. .)))', historical);
    expect(plain.lines.filter((line) => line.type === 'word').map((line) => line.form)).toEqual(['Þórður', 'sá', '.']);
  });

  // Source: Unicode Standard Annex #15, quick check (from memory): every code point below U+0300 has
  // NFC_Quick_Check=Yes and combining class 0, which is why forms made only of them skip normalizing.
  // Checked here against the runtime's own Unicode data, all 768 of them, alone and in pairs.
  it('has every character below U+0300 unchanged by normalization, alone and before any other', () => {
    for (let code = 0; code < 0x300; code++) {
      const char = String.fromCharCode(code);
      expect(char.normalize('NFC')).toBe(char);
      for (const next of ['a', 'e', 'A', 'Þ', 'ð', '\u02ff']) expect((char + next).normalize('NFC')).toBe(char + next);
    }
  });
});

import { describe, expect, it } from 'vitest';
import { validateConllu, where } from '../../support/read.js';

// Each case breaks the middle one of three sentences (its lines start at line 6)
// and names the code and line:col the problem must be reported at; the sentence
// after it must still be read. Format rules: UD v2 format specification (CHECK-VALUES §6).
const good = (n: number) => `# sent_id = s${n}\n# text = Gulls cried\n1\tGulls\tgull\tNOUN\tNNS\t_\t2\tnsubj\t_\t_\n2\tcried\tcry\tVERB\tVBD\t_\t0\troot\t_\t_\n\n`;
const w = (id: string, form: string, head: string, deprel: string, misc = '_', extra: Partial<Record<'lemma' | 'upos' | 'deps' | 'feats', string>> = {}) =>
  `${id}\t${form}\t${extra.lemma ?? form.toLowerCase()}\t${extra.upos ?? 'X'}\t_\t${extra.feats ?? '_'}\t${head}\t${deprel}\t${extra.deps ?? '_'}\t${misc}\n`;
const mw = (range: string, form: string, head = '_') => `${range}\t${form}\t_\t_\t_\t_\t${head}\t_\t_\t_\n`;
const head = (text: string, id = 'b') => `# sent_id = ${id}\n# text = ${text}\n`;

const cases: Array<[kind: string, broken: string, expected: string[]]> = [
  ['nine columns', head('Fog lifted') + '1\tFog\tfog\tNOUN\t_\t_\t2\tnsubj\t_\n' + w('2', 'lifted', '0', 'root'), ['wrong-column-count@8:29']],
  ['an empty column', head('Fog lifted') + '1\tFog\t\tNOUN\t_\t_\t2\tnsubj\t_\t_\n' + w('2', 'lifted', '0', 'root'), ['empty-field@8:7']],
  ['an ID that is no number', head('Fog lifted') + w('one', 'Fog', '2', 'nsubj') + w('2', 'lifted', '0', 'root'), ['invalid-id@8:1']],
  ['a word number skipped', head('Fog lifted') + w('1', 'Fog', '3', 'nsubj') + w('3', 'lifted', '0', 'root'), ['id-sequence@9:1']],
  ['an empty range', head('Fog lifted') + mw('1-1', 'Fog') + w('1', 'Fog', '2', 'nsubj') + w('2', 'lifted', '0', 'root'), ['bad-range@8:1']],
  ['a range after its words', head("Fog's lifted") + w('1', 'Fog', '3', 'nsubj', 'SpaceAfter=No') + mw('1-2', "Fog's") + w('2', "'s", '3', 'aux') + w('3', 'lifted', '0', 'root'), ['bad-range@9:1']],
  ['a range past the last word', head('Fog lifted') + w('1', 'Fog', '2', 'nsubj') + mw('2-3', 'lifted') + w('2', 'lifted', '0', 'root'), ['bad-range@9:1']],
  ['a multiword token with a head', head("Fog's up") + mw('1-2', "Fog's", '3') + w('1', 'Fog', '3', 'nsubj', 'SpaceAfter=No') + w('2', "'s", '3', 'cop') + w('3', 'up', '0', 'root'), ['multiword-fields@8:19']],
  ['an empty node out of order', head('Fog lifted') + w('1', 'Fog', '2', 'nsubj') + w('1.2', 'was', '_', '_', '_', { deps: '2:aux' }) + w('2', 'lifted', '0', 'root'), ['empty-node-sequence@9:1']],
  ['an empty node with a head', head('Fog lifted') + w('1', 'Fog', '2', 'nsubj') + w('1.1', 'was', '2', '_', '_', { deps: '2:aux' }) + w('2', 'lifted', '0', 'root'), ['empty-node-fields@9:19']],
  ['a head that is no number', head('Fog lifted') + w('1', 'Fog', 'two', 'nsubj') + w('2', 'lifted', '0', 'root'), ['head-not-word@8:17']],
  ['a relation in capitals', head('Fog lifted') + w('1', 'Fog', '2', 'NSUBJ') + w('2', 'lifted', '0', 'root'), ['relation-shape@8:19']],
  ['a space in UPOS', head('Fog lifted') + w('1', 'Fog', '2', 'nsubj', '_', { upos: 'PROPER NOUN' }) + w('2', 'lifted', '0', 'root'), ['unknown-upos@8:11', 'space-in-field@8:17']],
  ['a form not in NFC', head('Cafe\u0301 opened') + w('1', 'Cafe\u0301', '2', 'nsubj') + w('2', 'opened', '0', 'root'), ['not-nfc@8:3']],
  ['a CR LF line end', head('Fog lifted') + '1\tFog\tfog\tNOUN\t_\t_\t2\tnsubj\t_\t_\r\n' + w('2', 'lifted', '0', 'root'), ['carriage-return@8:31']],
  ['two blank lines', head('Fog lifted') + w('1', 'Fog', '2', 'nsubj') + w('2', 'lifted', '0', 'root') + '\n', ['extra-blank-line@11:1']],
  ['a comment among the words', head('Fog lifted') + w('1', 'Fog', '2', 'nsubj') + '# note\n' + w('2', 'lifted', '0', 'root'), ['comment-after-words@9:1']],
  ['no sent_id', '# text = Fog lifted\n' + w('1', 'Fog', '2', 'nsubj') + w('2', 'lifted', '0', 'root'), ['no-sentence-id@6:1']],
  ['no text', '# sent_id = b\n' + w('1', 'Fog', '2', 'nsubj') + w('2', 'lifted', '0', 'root'), ['no-text-comment@6:1']],
  ['two sent_id comments', head('Fog lifted') + '# sent_id = c\n' + w('1', 'Fog', '2', 'nsubj') + w('2', 'lifted', '0', 'root'), ['repeated-comment@8:1']],
  ['a sent_id used before', head('Fog lifted', 's1') + w('1', 'Fog', '2', 'nsubj') + w('2', 'lifted', '0', 'root'), ['duplicate-sent-id@6:1']],
  ['a head past the last word', head('Fog lifted') + w('1', 'Fog', '5', 'nsubj') + w('2', 'lifted', '0', 'root'), ['head-out-of-range@8:17']],
  ['no root', head('Fog lifted') + w('1', 'Fog', '2', 'nsubj') + w('2', 'lifted', '1', 'ccomp'), ['no-root@8:1', 'cycle@8:17']],
  ['two roots', head('Fog lifted') + w('1', 'Fog', '0', 'root') + w('2', 'lifted', '0', 'root'), ['several-root-words@9:23']],
  ['root with a head', head('Fog lifted') + w('1', 'Fog', '2', 'root') + w('2', 'lifted', '0', 'root'), ['root-relation@8:19']],
  ['a cycle away from the root', head('Fog rolled in') + w('1', 'Fog', '2', 'nsubj') + w('2', 'rolled', '0', 'root') + w('3', 'in', '3', 'compound'), ['cycle@10:15']],
  ['text that does not match', head('Fog lifted.') + w('1', 'Fog', '2', 'nsubj') + w('2', 'lifted', '0', 'root'), ['text-differs@7:20']],
  // Word-level checks of UD v2 (CHECK-VALUES §6 and §9): the 17 tags, features, DEPS, MISC.
  ['a UPOS outside the 17 tags', head('Fog lifted') + w('1', 'Fog', '2', 'nsubj', '_', { upos: 'NOUNX' }) + w('2', 'lifted', '0', 'root'), ['unknown-upos@8:11']],
  ['FEATS that are not Name=Value', head('Fog lifted') + w('1', 'Fog', '2', 'nsubj', '_', { feats: 'Case=Nom|bad' }) + w('2', 'lifted', '0', 'root'), ['feats-shape@8:15']],
  ['FEATS out of order', head('Fog lifted') + w('1', 'Fog', '2', 'nsubj', '_', { feats: 'Number=Sing|Case=Nom' }) + w('2', 'lifted', '0', 'root'), ['feats-shape@8:15']],
  ['a feature value outside the inventory (a warning)', head('Fog lifted') + w('1', 'Fog', '2', 'nsubj', '_', { feats: 'Case=Nomm' }) + w('2', 'lifted', '0', 'root'), ['unknown-feature@8:15']],
  ['DEPS that are not head:relation', head('Fog lifted') + w('1', 'Fog', '2', 'nsubj', '_', { deps: 'two:nsubj' }) + w('2', 'lifted', '0', 'root'), ['deps-shape@8:25']],
  ['DEPS pointing at a missing word', head('Fog lifted') + w('1', 'Fog', '2', 'nsubj', '_', { deps: '2:nsubj|5:obj' }) + w('2', 'lifted', '0', 'root'), ['deps-target@8:33']],
  ['DEPS pointing at the word itself', head('Fog lifted') + w('1', 'Fog', '2', 'nsubj', '_', { deps: '1:nsubj' }) + w('2', 'lifted', '0', 'root'), ['deps-target@8:25']],
  ['an empty MISC item', head('Fog lifted') + w('1', 'Fog', '2', 'nsubj', 'SpaceAfter=No||X=1') + w('2', 'lifted', '0', 'root'), ['text-differs@7:13', 'misc-shape@8:27']],
  ['an unknown relation (a warning)', head('Fog lifted') + w('1', 'Fog', '2', 'subject') + w('2', 'lifted', '0', 'root'), ['unknown-relation@8:19']],
];

describe('broken CoNLL-U', () => {
  it.each(cases)('reports %s with its code and line:col, and reads the sentence after it', (_kind, broken, expected) => {
    const { sentences, problems } = validateConllu(good(1) + broken + '\n' + good(3));
    expect(where(problems)).toEqual(expected);
    expect(sentences.map((s) => s.id)).toContain('s3');
    expect(sentences[0]!.id).toBe('s1');
  });

  it('covers at least twenty kinds of problem', () => {
    expect(new Set(cases.flatMap(([, , codes]) => codes.map((c) => c.split('@')[0]))).size).toBeGreaterThanOrEqual(20);
  });

  it('names the words on a cycle', () => {
    const { problems } = validateConllu(head('Fog rolled in') + w('1', 'Fog', '3', 'nsubj') + w('2', 'rolled', '0', 'root') + w('3', 'in', '1', 'compound') + '\n');
    expect(problems.map((p) => p.message)).toEqual(['heads go round in a circle: 1 "Fog" → 3 "in" → 1']);
  });

  it('reports a missing final newline and a missing blank line at the end of the file', () => {
    const { problems } = validateConllu(good(1).trimEnd());
    expect(where(problems)).toEqual(['no-final-newline@4:34', 'missing-blank-line@4:34']);
  });

  it('compares # text with the spacing SpacesAfter gives, escapes undone (UD v2 format, from memory)', () => {
    const text = head('Fog  rolled in') + w('1', 'Fog', '2', 'nsubj', 'SpacesAfter=\\s\\s') + w('2', 'rolled', '0', 'root') + w('3', 'in', '2', 'compound', 'SpacesAfter=\\n') + '\n';
    expect(validateConllu(text).problems).toEqual([]);
  });

  it('accepts relations declared with --relations, subtypes included', () => {
    const text = head('Fog lifted') + w('1', 'Fog', '2', 'subject:weather') + w('2', 'lifted', '0', 'root') + '\n';
    expect(validateConllu(text, ['subject', 'root']).problems).toEqual([]);
  });
});

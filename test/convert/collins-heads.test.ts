import { describe, expect, it } from 'vitest';
import { headOf } from '../support/convert.js';

// Collins (1999), Appendix A, as reprinted in Jurafsky & Martin §19.9 and Bikel
// (2004) (CHECK-VALUES §5): the head chosen for each parent category of the
// en-function table, on invented phrases of our own.
describe('the en-function table (Collins 1999)', () => {
  it.each([
    ['VP: the modal before the verb', '(VP (MD will) (VB sail))', 'will'],
    ['VP: to first', '(VP (TO to) (VP (VB sail)))', 'to'],
    ['S: the verb phrase', '(S (NP-SBJ (NNP Mira)) (VP (VBD waved)) (. .))', 'waved'],
    ['SBAR: the complementiser', '(SBAR (IN that) (S (NP-SBJ (NN fog)) (VP (VBD lifted))))', 'that'],
    ['PP: the preposition, from the right', '(PP (IN on) (NP (DT the) (NN pier)))', 'on'],
    ['ADJP: the adjective after an adverb', '(ADJP (RB very) (JJ old))', 'old'],
    ['ADVP: the rightmost adverb', '(ADVP (RB very) (RB late))', 'late'],
    ['SQ: the finite verb', '(SQ (VBD Did) (NP-SBJ (NNP Mira)) (VP (VB see)))', 'Did'],
    ['SINV: the finite verb', '(SINV (VBD said) (NP-SBJ (NNP Tomas)))', 'said'],
    ['WHNP: the wh-determiner', '(WHNP (WDT which) (NN boat))', 'which'],
    ['WHADVP: the wh-adverb', '(WHADVP (WRB when))', 'when'],
    ['QP: the priority list before the number', '(QP (RB about) (CD seven))', 'about'],
    ['PRT: the particle', '(PRT (RP up))', 'up'],
    ['CONJP: from the right, an adverb before a preposition', '(CONJP (RB as) (RB well) (IN as))', 'well'],
    ['SBARQ: the question clause', '(SBARQ (WHNP (WDT Which) (NN boat)) (SQ (VBD sank)) (. ?))', 'sank'],
  ])('%s', (_name, phrase, head) => {
    expect(headOf(phrase, 'en-function')).toBe(head);
  });

  // The NP rule, step by step (Collins 1999; J&M §19.9).
  it.each([
    ['(1) a last child tagged POS', "(NP (NP (DT the) (NN keeper)) (POS 's))", "'s"],
    ['(2) from the right, a noun', '(NP (DT the) (JJ old) (NN ferry))', 'ferry'],
    ['(3) from the left, a noun phrase', '(NP (NP (DT the) (NN crate)) (PP (IN of) (NP (NN salt))))', 'crate'],
    ['(4) from the right, an adjective phrase', '(NP (DT the) (ADJP (RB very) (JJ old)))', 'old'],
    ['(5) from the right, a number', '(NP (DT the) (CD two))', 'two'],
    ['(6) from the right, an adjective', '(NP (DT the) (JJ rich))', 'rich'],
    ['(7) else the last word', '(NP (DT this))', 'this'],
  ])('NP step %s', (_name, phrase, head) => {
    expect(headOf(phrase, 'en-function')).toBe(head);
  });

  it('applies the coordination rule: a head after a coordinator that is not first gives way to the child before (Bikel 2004 §4.12)', () => {
    expect(headOf('(NP (NN salt) (CC and) (NN pepper))', 'en-function')).toBe('salt');
    // A coordinator in first place does not count.
    expect(headOf('(NP (CC and) (NN pepper))', 'en-function')).toBe('pepper');
  });
});

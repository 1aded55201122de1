import { readBracketedText } from '../formats/bracketed/read-bracketed.js';
import type { ConstituentNode, Tree } from '../model/constituency.js';
import type { DependencySentence } from '../model/dependency.js';
import { parseLabel } from '../model/label.js';
import { BRACKETS_KEY } from './encode-brackets.js';
import { LEAF_KEY, LEAF_LEMMA_KEY } from './carry-brackets.js';
import { carriedTexts, type CarrySide } from './carry-wordless-trees.js';

const unescape = (text: string) => text.replace(/%([0-9a-f]{2})/g, (_, hex: string) => String.fromCharCode(parseInt(hex, 16)));

/** A carried bracketing that cannot be rebuilt: a word used twice, a phrase that contains itself, a word that is not there. */
export interface BrokenCarry {
  problem: string;
}

/**
 * Rebuilds the bracketing carried in lossless mode (see encode-brackets):
 * undefined when the sentence does not carry one, {@link BrokenCarry} when
 * what it carries does not make a tree (hand-edited or corrupted MISC).
 * Phrases are rebuilt bottom-up without recursion, however deep the tree.
 */
export function decodeBrackets(sentence: DependencySentence): Tree | BrokenCarry | undefined {
  const comment = sentence.comments.find((c) => /^\s*brackets\s*=/.test(c.text));
  if (!comment) return undefined;
  const fields = comment.text.replace(/^\s*brackets\s*=\s*/, '').split('; ');
  const wrapperField = fields.find((f) => f.startsWith('wrapper'));
  const hasId = fields.includes('id=yes');
  const topField = fields.find((f) => f.startsWith('top='));
  if (!wrapperField || !topField) return { problem: 'the # brackets comment lacks its wrapper or top field' };
  const words = sentence.lines.filter((l) => l.type === 'word');
  const chains = words.map((word) => {
    const value = word.misc.split('|').find((part) => part.startsWith(`${BRACKETS_KEY}=`));
    return value === undefined ? [] : value.slice(BRACKETS_KEY.length + 1).split('>').filter(Boolean);
  });
  // A wordless node was written out whole; it is read back inside an outer bracket of its own.
  const verbatim = (text: string): ConstituentNode | undefined => readBracketedText(`( ${unescape(text)} )`, {}, () => undefined)[0]?.children[0];
  const levelsOf = (index: number) =>
    chains[index - 1]!.map((level) => {
      const open = level.indexOf('{');
      return { label: level.slice(0, open), specs: open === -1 ? [] : level.slice(open + 1, -1).split(',') };
    });
  const referenced = (spec: string) => (spec.startsWith('d') ? Number(spec.slice(1)) : undefined);
  const topSpecs = topField.slice(4).split(',');

  // Each word's phrases are built once all the words they point to are built: a post-order over the
  // references, which must form a tree (each word used once, none inside itself).
  const built = new Map<number, ConstituentNode>();
  const state = new Uint8Array(words.length + 1); // 0 unseen, 1 waiting for the words it points to, 2 built
  const pending: Array<{ index: number; expanded: boolean }> = [];
  const request = (index: number): string | undefined => {
    if (!Number.isInteger(index) || index < 1 || index > words.length) return `a phrase points to word ${index}, which the sentence does not have`;
    if (state[index] !== 0) return `word ${index} is used by two phrases, or inside its own phrase`;
    state[index] = 1;
    pending.push({ index, expanded: false });
    return undefined;
  };
  for (const spec of topSpecs) {
    const index = referenced(spec);
    if (index === undefined) continue;
    const problem = request(index);
    if (problem) return { problem };
    while (pending.length > 0) {
      const entry = pending.pop()!;
      if (!entry.expanded) {
        pending.push({ index: entry.index, expanded: true });
        for (const level of levelsOf(entry.index)) {
          for (const inner of level.specs) {
            const target = referenced(inner);
            if (target === undefined) continue;
            const trouble = request(target);
            if (trouble) return { problem: trouble };
          }
        }
        continue;
      }
      const word = words[entry.index - 1]!;
      // The leaf as written, where the output changed it (escapes undone, join markers taken off).
      const leaf = miscValue(word.misc, LEAF_KEY);
      const leafLemma = miscValue(word.misc, LEAF_LEMMA_KEY);
      let current: ConstituentNode = {
        type: 'preterminal',
        pos: word.xpos,
        word: { type: 'word', form: leaf ?? word.form, lemma: leafLemma ?? (word.lemma === '_' ? undefined : word.lemma) },
      };
      for (const level of levelsOf(entry.index)) {
        const children: ConstituentNode[] = [];
        for (const spec of level.specs) {
          const node = spec === 'h' ? current : item(spec);
          if (node) children.push(node);
        }
        current = { type: 'phrase', label: parseLabel(unescape(level.label)), children };
      }
      built.set(entry.index, current);
      state[entry.index] = 2;
    }
  }
  for (let index = 1; index <= words.length; index++) if (state[index] !== 2) return { problem: `word ${index} is in no phrase of the carried bracketing` };
  function item(spec: string): ConstituentNode | undefined {
    const index = referenced(spec);
    if (index !== undefined) return built.get(index);
    if (spec.startsWith('n')) return verbatim(spec.slice(1));
    return undefined;
  }
  const top = topSpecs.map(item).filter((n): n is ConstituentNode => n !== undefined);
  const wrapper = wrapperField.startsWith('wrapper=') ? { label: unescape(wrapperField.slice(8)) } : undefined;
  return { type: 'tree', wrapper, children: top, id: hasId ? sentence.id : undefined, idPosition: undefined, position: undefined, file: sentence.file, source: undefined };
}

/** True for what {@link decodeBrackets} gives back when the carried bracketing is broken. */
export function isBrokenCarry(result: Tree | BrokenCarry | undefined): result is BrokenCarry {
  return result !== undefined && 'problem' in result;
}

/** A MISC value by key, percent-escapes undone; undefined when absent. */
function miscValue(misc: string, key: string): string | undefined {
  const part = misc.split('|').find((p) => p.startsWith(`${key}=`));
  return part === undefined ? undefined : unescape(part.slice(key.length + 1));
}

/** The trees without words that lossless mode carried on one side of a sentence (see carry-wordless-trees). */
export function decodeCarriedTrees(sentence: DependencySentence, side: CarrySide): Tree[] {
  return carriedTexts(sentence.comments, side).flatMap((text) => readBracketedText(text, {}, () => undefined).map((tree) => ({ ...tree, position: undefined, source: undefined, idPosition: undefined, file: sentence.file })));
}

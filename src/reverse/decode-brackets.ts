import { readBracketedText } from '../formats/bracketed/read-bracketed.js';
import type { ConstituentNode, Tree } from '../model/constituency.js';
import type { DependencySentence } from '../model/dependency.js';
import { parseLabel } from '../model/label.js';
import { BRACKETS_KEY } from '../convert/encode-brackets.js';
import { carriedTexts, type CarrySide } from '../convert/carry-wordless-trees.js';

const unescape = (text: string) => text.replace(/%([0-9a-f]{2})/g, (_, hex: string) => String.fromCharCode(parseInt(hex, 16)));

/**
 * Rebuilds the bracketing carried in lossless mode (see encode-brackets):
 * undefined when the sentence does not carry one.
 */
export function decodeBrackets(sentence: DependencySentence): Tree | undefined {
  const comment = sentence.comments.find((c) => /^\s*brackets\s*=/.test(c.text));
  if (!comment) return undefined;
  const fields = comment.text.replace(/^\s*brackets\s*=\s*/, '').split('; ');
  const wrapperField = fields.find((f) => f.startsWith('wrapper'));
  const hasId = fields.includes('id=yes');
  const topField = fields.find((f) => f.startsWith('top='));
  if (!wrapperField || !topField) return undefined;
  const words = sentence.lines.filter((l) => l.type === 'word');
  const chains = words.map((word) => {
    const value = word.misc.split('|').find((part) => part.startsWith(`${BRACKETS_KEY}=`));
    return value === undefined ? [] : value.slice(BRACKETS_KEY.length + 1).split('>').filter(Boolean);
  });
  // A wordless node was written out whole; it is read back inside an outer bracket of its own.
  const verbatim = (text: string): ConstituentNode | undefined => readBracketedText(`( ${unescape(text)} )`, {}, () => undefined)[0]?.children[0];
  const build = (index: number): ConstituentNode | undefined => {
    const word = words[index - 1];
    if (!word) return undefined;
    let current: ConstituentNode = {
      type: 'preterminal',
      pos: word.xpos,
      word: { type: 'word', form: word.form, lemma: word.lemma === '_' ? undefined : word.lemma },
    };
    for (const level of chains[index - 1]!) {
      const open = level.indexOf('{');
      const label = parseLabel(unescape(level.slice(0, open)));
      const children: ConstituentNode[] = [];
      for (const spec of level.slice(open + 1, -1).split(',')) {
        const node = spec === 'h' ? current : item(spec);
        if (node) children.push(node);
      }
      current = { type: 'phrase', label, children };
    }
    return current;
  };
  const item = (spec: string): ConstituentNode | undefined => {
    if (spec.startsWith('d')) return build(Number(spec.slice(1)));
    if (spec.startsWith('n')) return verbatim(spec.slice(1));
    return undefined;
  };
  const top = topField.slice(4).split(',').map(item).filter((n): n is ConstituentNode => n !== undefined);
  const wrapper = wrapperField.startsWith('wrapper=') ? { label: unescape(wrapperField.slice(8)) } : undefined;
  return { type: 'tree', wrapper, children: top, id: hasId ? sentence.id : undefined, idPosition: undefined, position: undefined, file: sentence.file, source: undefined };
}

/** The trees without words that lossless mode carried on one side of a sentence (see carry-wordless-trees). */
export function decodeCarriedTrees(sentence: DependencySentence, side: CarrySide): Tree[] {
  return carriedTexts(sentence.comments, side).flatMap((text) => readBracketedText(text, {}, () => undefined).map((tree) => ({ ...tree, position: undefined, source: undefined, idPosition: undefined, file: sentence.file })));
}

/**
 * Reading and writing leaves: empty-element recognition, bracket escapes and
 * `form-lemma` splitting. The empty-element shapes follow the bracketing
 * conventions (Bies et al. 1995, from memory; ../shared/CHECK-VALUES.md §8):
 * `*T*-1`, `*ICH*-2`, `*EXP*-1`, `*RNR*-1`, `*U*`, `*PRO*`, `*`, `*-1`, `0`,
 * and the lower-case kinds of historical corpora (`*pro*`, `*con*`, `*exp*`),
 * which may carry the case of the empty subject (`*con*-D`).
 */

/** A named empty element, `*T*`, `*pro*`, `*ICH*-2`, `*con*-D`: a name between stars, then an index or a suffix (the case of an empty subject). */
const NAMED = /^(\*[^*\s]+\*)(?:-(\S*))?$/;
/** A bare star, perhaps with an index: `*`, `*-1`. */
const BARE = /^\*(?:-(\d+))?$/;
const NONE = '-NONE-';
const STAR = 42; // *

/**
 * The parts of an empty element's leaf, or undefined when the leaf is a word.
 * A named element (`*T*-1`, `*pro*`, `*con*-D`) is empty under any tag: no
 * word is written that way. A bare `*` or `0` is a word under a literal tag
 * (a star tagged SYM, the number 0 tagged CD), else empty. Under `-NONE-`
 * every leaf is empty. A suffix that is not a number (the case of an empty
 * subject, `-D`) is part of the leaf as written, not an index.
 */
export function readEmptyLeaf(
  text: string,
  tag: string,
  isLiteralTag: (tag: string) => boolean,
): { kind: string; refIndex?: number } | undefined {
  // Almost every leaf is a word that neither starts with `*` nor is `0`: settle those before any lookup.
  if (tag !== NONE && text.charCodeAt(0) !== STAR && text !== '0') return undefined;
  const named = NAMED.exec(text);
  if (named) {
    const suffix = named[2];
    return suffix !== undefined && /^\d+$/.test(suffix) ? { kind: named[1]!, refIndex: Number(suffix) } : { kind: named[1]! };
  }
  if (tag !== NONE && isLiteralTag(tag)) return undefined;
  const bare = BARE.exec(text);
  if (bare) return bare[1] === undefined ? { kind: '*' } : { kind: '*', refIndex: Number(bare[1]) };
  if (text === '0') return { kind: '0' };
  if (tag === NONE) {
    // Under -NONE- every leaf is empty, whatever its shape: keep an index if it has one.
    const indexed = /^(.*\S)-(\d+)$/.exec(text);
    return indexed ? { kind: indexed[1]!, refIndex: Number(indexed[2]) } : { kind: text };
  }
  return undefined;
}

/** Builds the test for literal tags: the listed ones and every tag starting `NUM`. */
export function literalTagTest(tags: string[]): (tag: string) => boolean {
  const set = new Set(tags);
  return (tag) => set.has(tag) || tag.startsWith('NUM');
}

/** Undoes `\(`, `\)` and `\\`; other backslashes are literal. */
export function unescapeLeaf(text: string): string {
  return text.includes('\\') ? text.replace(/\\([()\\])/g, '$1') : text;
}

/** Escapes brackets and backslashes so that the leaf reads back as it is. */
export function escapeLeaf(text: string): string {
  return /[()\\]/.test(text) ? text.replace(/[()\\]/g, '\\$&') : text;
}

/**
 * Splits `form-lemma` at the last hyphen that has something after it (so `---`
 * is form `-`, lemma `-`); undefined when there is no lemma part.
 */
export function splitLemma(text: string): { form: string; lemma: string } | undefined {
  const hyphen = text.lastIndexOf('-', text.length - 2);
  if (hyphen <= 0) return undefined;
  return { form: text.slice(0, hyphen), lemma: text.slice(hyphen + 1) };
}

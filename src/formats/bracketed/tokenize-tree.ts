import type { TreeTokens } from './tree-assembly.js';

const OPEN = 40;
const CLOSE = 41;
const BACKSLASH = 92;
const WORD = 119; // 'w'
const LEAF = 112; // 'p': a whole `(tag word)` bracket
/** U+FFFD, what the decoder puts where bytes are not valid UTF-8. */
const REPLACEMENT = 0xfffd;

/** Whitespace between tokens: space, tab, line feed, carriage return, form feed, vertical tab. */
function isSpace(code: number): boolean {
  return code === 32 || (code >= 9 && code <= 13);
}

/** Scratch arrays reused from tree to tree: allocating typed arrays per tree costs more than filling them. */
let kinds = new Uint8Array(4096);
let starts = new Int32Array(4096);
let ends = new Int32Array(4096);
let tagStarts = new Int32Array(4096);
let tagEnds = new Int32Array(4096);
let wordStarts = new Int32Array(4096);
let wordEnds = new Int32Array(4096);

/**
 * Cuts one tree's text into bracket and word tokens (see grammars/bracketed.peggy).
 * A backslash before a bracket or a backslash escapes it inside a word; any
 * other backslash is an ordinary character. A bracket of exactly two words
 * below the top, `(tag word)`, the commonest bracket of all, becomes one leaf
 * token, so the grammar handles it in one step. The returned spans are views
 * of scratch arrays: they are valid until the next call, long enough to build the tree.
 */
export function tokenizeTree(text: string): TreeTokens {
  const length = text.length;
  let capacity = kinds.length;
  let count = 0;
  let replacement = -1;
  let depth = 0;
  let i = 0;
  while (i < length) {
    const code = text.charCodeAt(i);
    if (isSpace(code)) {
      i++;
      continue;
    }
    if (count === capacity) {
      capacity *= 2;
      kinds = grow(kinds, new Uint8Array(capacity));
      starts = grow(starts, new Int32Array(capacity));
      ends = grow(ends, new Int32Array(capacity));
      tagStarts = grow(tagStarts, new Int32Array(capacity));
      tagEnds = grow(tagEnds, new Int32Array(capacity));
      wordStarts = grow(wordStarts, new Int32Array(capacity));
      wordEnds = grow(wordEnds, new Int32Array(capacity));
    }
    if (code === CLOSE && depth > 1 && count >= 3 && kinds[count - 3] === OPEN && kinds[count - 2] === WORD && kinds[count - 1] === WORD) {
      const leaf = count - 3;
      kinds[leaf] = LEAF;
      tagStarts[leaf] = starts[leaf + 1]!;
      tagEnds[leaf] = ends[leaf + 1]!;
      wordStarts[leaf] = starts[leaf + 2]!;
      wordEnds[leaf] = ends[leaf + 2]!;
      ends[leaf] = ++i;
      count = leaf + 1;
      depth--;
      continue;
    }
    starts[count] = i;
    if (code === OPEN || code === CLOSE) {
      kinds[count] = code;
      depth += code === OPEN ? 1 : -1;
      i++;
    } else {
      kinds[count] = WORD;
      while (i < length) {
        const c = text.charCodeAt(i);
        if (c === BACKSLASH) {
          const next = text.charCodeAt(i + 1);
          i += next === OPEN || next === CLOSE || next === BACKSLASH ? 2 : 1;
        } else if (c === OPEN || c === CLOSE || isSpace(c)) {
          break;
        } else {
          if (c === REPLACEMENT && replacement === -1) replacement = i;
          i++;
        }
      }
    }
    ends[count] = i;
    count++;
  }
  return {
    kinds: kindString(count),
    starts: starts.subarray(0, count),
    ends: ends.subarray(0, count),
    tagStarts: tagStarts.subarray(0, count),
    tagEnds: tagEnds.subarray(0, count),
    wordStarts: wordStarts.subarray(0, count),
    wordEnds: wordEnds.subarray(0, count),
    replacement,
  };
}

/** The first `count` kinds as a string, built in slices that stay under the engine's argument limit. */
function kindString(count: number): string {
  let result = '';
  for (let from = 0; from < count; from += 8192) {
    result += String.fromCharCode.apply(null, kinds.subarray(from, Math.min(count, from + 8192)) as unknown as number[]);
  }
  return result;
}

function grow<T extends Uint8Array | Int32Array>(from: T, to: T): T {
  to.set(from);
  return to;
}

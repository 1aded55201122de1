import { diagnose, type Report } from '../diagnostics/diagnostic.js';
import type { DiagnosticCode } from '../diagnostics/codes.js';
import type { DependencySentence, DependencyWord, MultiwordToken } from '../model/dependency.js';
import { fieldColumn } from '../formats/conllu/conllu-line.js';

/**
 * Checks that the basic layer of a sentence is a tree (UD v2 format
 * specification; ../shared/CHECK-VALUES.md §6): every HEAD names a word or 0,
 * exactly one word has HEAD 0 and only it is `root`, no word is its own
 * ancestor, and `# text` matches the forms and their spacing.
 */
export function checkDependencyTree(sentence: DependencySentence, report: Report): void {
  checkHeads(sentence, report);
  checkText(sentence, report);
}

/**
 * The tree part of {@link checkDependencyTree}: HEADs in range, one root,
 * `root` exactly for HEAD 0, no cycle; each problem at the word it concerns.
 */
export function checkHeads(sentence: DependencySentence, report: Report): void {
  const words = sentence.lines.filter((line): line is DependencyWord => line.type === 'word');
  const at = (code: DiagnosticCode, word: { position?: { start: number } }, column: number, message: string) => {
    if (!sentence.source || !word.position) return;
    const where = { file: sentence.file ?? '-', offset: word.position.start + column - 1, lines: sentence.source };
    report(diagnose(code, message, where));
  };
  const column = (word: DependencyWord, index: number) => fieldColumn(lineFields(word), index);

  const heads: number[] = [0];
  let numeric = true;
  for (const word of words) {
    const head = /^(0|[1-9]\d*)$/.test(word.head) ? Number(word.head) : NaN;
    if (Number.isNaN(head)) numeric = false;
    heads.push(head);
  }
  const count = words.length;
  const roots: DependencyWord[] = [];
  words.forEach((word, index) => {
    const head = heads[index + 1]!;
    if (Number.isNaN(head)) return;
    if (head > count) at('head-out-of-range', word, column(word, 6), `HEAD ${head}, but the sentence has ${count} word${count === 1 ? '' : 's'}`);
    if (head === 0) roots.push(word);
    const isRoot = word.deprel === 'root' || word.deprel.startsWith('root:');
    if (isRoot !== (head === 0)) {
      at('root-relation', word, column(word, 7), isRoot ? `DEPREL "root" with HEAD ${head}; only the word with HEAD 0 is root` : `HEAD 0 with DEPREL "${word.deprel}"; the word with HEAD 0 is root`);
    }
  });
  if (numeric && roots.length === 0 && count > 0) at('no-root', words[0]!, 1, 'no word has HEAD 0: the sentence has no root');
  if (roots.length > 1) {
    const ids = roots.map((word) => word.id).join(', ');
    at('several-root-words', roots[1]!, column(roots[1]!, 6), `words ${ids} all have HEAD 0; a sentence has one root`);
  }
  if (numeric) for (const cycle of findCycles(heads)) {
    const first = words[cycle[0]! - 1]!;
    const named = cycle.map((id) => `${id} "${words[id - 1]!.form}"`).join(' → ');
    at('cycle', first, column(first, 6), `heads go round in a circle: ${named} → ${cycle[0]}`);
  }
}

/** Each cycle of a head vector once, as word numbers from its smallest member on. */
export function findCycles(heads: number[]): number[][] {
  const state = new Uint8Array(heads.length); // 0 unseen, 1 on the current path, 2 done
  const cycles: number[][] = [];
  for (let start = 1; start < heads.length; start++) {
    if (state[start] !== 0) continue;
    const path: number[] = [];
    let node = start;
    while (node >= 1 && node < heads.length && state[node] === 0) {
      state[node] = 1;
      path.push(node);
      node = heads[node]!;
    }
    if (node >= 1 && node < heads.length && state[node] === 1) {
      const cycle = path.slice(path.indexOf(node));
      const smallest = cycle.indexOf(Math.min(...cycle));
      cycles.push([...cycle.slice(smallest), ...cycle.slice(0, smallest)]);
    }
    for (const visited of path) state[visited] = 2;
  }
  return cycles;
}

/** `# text` against the surface: token forms (a multiword token's form for its words), spaced unless SpaceAfter=No. */
function checkText(sentence: DependencySentence, report: Report): void {
  const comment = sentence.comments.find((c) => /^\s*text\s*=/.test(c.text));
  if (!comment || !comment.position || !sentence.source) return;
  const expected = comment.text.replace(/^\s*text\s*=\s?/, '');
  let surface = '';
  let coveredTo = 0;
  const tokens: Array<DependencyWord | MultiwordToken> = [];
  for (const line of sentence.lines) {
    if (line.type === 'multiword') {
      tokens.push(line);
      coveredTo = Number(line.id.split('-')[1]);
    } else if (line.type === 'word' && Number(line.id) > coveredTo) {
      tokens.push(line);
    }
  }
  tokens.forEach((token, index) => {
    surface += token.form;
    if (index < tokens.length - 1) surface += spaceAfter(token.misc);
  });
  if (surface === expected) return;
  // # text may write the spacing of SpacesAfter (two spaces, a line break) as one space: compare with spacing folded too.
  const fold = (text: string) => text.replace(/\s+/g, ' ').trim();
  if (fold(surface) === fold(expected)) return;
  let differ = 0;
  while (differ < surface.length && surface[differ] === expected[differ]) differ++;
  const prefix = comment.text.length - expected.length + 1; // "#" and " text = "
  const where = { file: sentence.file ?? '-', offset: comment.position.start + prefix + differ, lines: sentence.source };
  const shown = (text: string) => JSON.stringify(text.slice(Math.max(0, differ - 10), differ + 20));
  report(diagnose('text-differs', `# text reads ${shown(expected)} where the words give ${shown(surface)}`, where));
}

function lineFields(word: DependencyWord): string[] {
  return [word.id, word.form, word.lemma, word.upos, word.xpos, word.feats, word.head, word.deprel, word.deps, word.misc];
}

/**
 * The spacing after a token, from MISC: `SpaceAfter=No` none, `SpacesAfter=…`
 * the spacing written with escapes (`\s` space, `\t` tab, `\n` and `\r` line
 * breaks, `\p` a bar, `\\` a backslash, `\uXXXX` any character), else one space
 * (UD v2 format specification, from memory).
 */
export function spaceAfter(misc: string): string {
  let spaces: string | undefined;
  for (const item of misc.split('|')) {
    if (item === 'SpaceAfter=No') return '';
    if (item.startsWith('SpacesAfter=')) spaces = item.slice('SpacesAfter='.length);
  }
  if (spaces === undefined) return ' ';
  return spaces.replace(/\\(u([0-9A-Fa-f]{4})|.)/g, (_, escape: string, hex: string | undefined) => {
    if (hex) return String.fromCharCode(parseInt(hex, 16));
    return ({ s: ' ', t: '\t', n: '\n', r: '\r', p: '|', '\\': '\\' } as Record<string, string>)[escape] ?? escape;
  });
}

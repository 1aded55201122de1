import { parseLabel } from '../model/label.js';
import type { HeadWordTestSyntax, PatternSyntax } from './table-syntax.js';

/** What a pattern looks at: a child of a phrase, by its label and its head word. */
export interface Candidate {
  /** Category of the child's label (a preterminal's tag is parsed like a label: `N-N` is category N, tag N). */
  category: string;
  /** Function tags of the child's label. */
  functions: readonly string[];
  /** The child's lexical head word, when it has one. */
  headWord?: { pos: string; form: string; lemma: string | undefined };
}

/** A compiled pattern. */
export type Matcher = (candidate: Candidate) => boolean;

/**
 * Compiles a label pattern: `NP` (category NP, any function tags), `NP-PRD`
 * (and function tag PRD), `NP-` (NP without function tags), `*-PRD` (any category with PRD), `*-` (any category
 * without function tags), `VB*` (category starting VB), `*` (anything); a head-word test `[pos=…]`, `[form=…]` or
 * `[lemma=…]` narrows it, `[form!=…]` narrows it to the other words (values may hold `*` for any run
 * of characters; forms and lemmas compare without case).
 */
export function compilePattern(pattern: PatternSyntax): Matcher {
  const label = compileLabel(pattern.label);
  if (!pattern.test) return label;
  const test = compileHeadWordTest(pattern.test);
  return (candidate) => label(candidate) && test(candidate);
}

/**
 * Compiles a list of patterns into one test that holds when any of them does.
 * Plain categories (`NP`, `VBD`: no function tag, no `*`, no head-word test)
 * are looked up in a set, as tables list many and a conversion asks often.
 */
export function compileAnyOf(patterns: PatternSyntax[]): Matcher {
  const categories = new Set<string>();
  const others: Matcher[] = [];
  for (const pattern of patterns) {
    const plain = !pattern.test && !pattern.label.includes('*') && !isTaglessPattern(pattern.label) ? parseLabel(pattern.label) : undefined;
    if (plain && plain.functions.length === 0) categories.add(plain.category);
    else others.push(compilePattern(pattern));
  }
  if (others.length === 0) return (candidate) => categories.has(candidate.category);
  if (categories.size === 0) return others.length === 1 ? others[0]! : (candidate) => others.some((m) => m(candidate));
  return (candidate) => categories.has(candidate.category) || others.some((m) => m(candidate));
}

/**
 * Whether a pattern could match some candidate of a category, whatever its
 * function tags and head word: `VB*` could for VBD, `*-PRD` for any, `NP-PRD`
 * only for NP. Lets a table set aside the rules that cannot hold for a category.
 */
export function categoryCouldMatch(pattern: PatternSyntax): (category: string) => boolean {
  const text = pattern.label;
  if (text === '*' || text.startsWith('*-')) return () => true;
  if (isTaglessPattern(text)) return (category) => category === text.slice(0, -1);
  if (text.endsWith('*') && text.length > 1) return (category) => category.startsWith(text.slice(0, -1));
  const wanted = parseLabel(text).category;
  return (category) => category === wanted;
}

/** `NP-`: a category (with no hyphen of its own, unlike `-LRB-`) and a final hyphen. */
function isTaglessPattern(text: string): boolean {
  return /^[^-*]+-$/.test(text);
}

function compileLabel(text: string): Matcher {
  if (text === '*') return () => true;
  // `*-`: any child without function tags (the head of a bracketing built by to-brackets).
  if (text === '*-') return (candidate) => candidate.functions.length === 0;
  if (text.startsWith('*-')) {
    const tags = text.slice(2).split('-');
    return (candidate) => tags.every((tag) => candidate.functions.includes(tag));
  }
  // `NP-`: that category without function tags.
  if (isTaglessPattern(text)) {
    const category = text.slice(0, -1);
    return (candidate) => candidate.category === category && candidate.functions.length === 0;
  }
  if (text.endsWith('*') && text.length > 1) {
    const prefix = text.slice(0, -1);
    return (candidate) => candidate.category.startsWith(prefix);
  }
  const wanted = parseLabel(text);
  if (wanted.functions.length === 0) return (candidate) => candidate.category === wanted.category;
  return (candidate) => candidate.category === wanted.category && wanted.functions.every((tag) => candidate.functions.includes(tag));
}

function compileHeadWordTest(test: HeadWordTestSyntax): Matcher {
  const listed = valueTest(test.values, test.key !== 'pos');
  const matches = test.negated ? (value: string) => !listed(value) : listed;
  return (candidate) => {
    const word = candidate.headWord;
    if (!word) return false;
    if (test.key === 'pos') return matches(word.pos);
    if (test.key === 'form') return matches(word.form);
    return matches(word.lemma ?? word.form);
  };
}

/** A test of a value against a list: exact, or a prefix for values ending in `*`; without case when asked. */
export function valueTest(values: string[], ignoreCase: boolean): (value: string) => boolean {
  const norm = (value: string) => (ignoreCase ? value.toLowerCase() : value);
  const exact = new Set(values.filter((v) => !v.includes('*')).map(norm));
  // Values with `*` anywhere are patterns: `VB*` a prefix, `*-D` a suffix, `*` anything.
  const patterns = values.filter((v) => v.includes('*')).map((v) => globTest(norm(v)));
  return (value) => {
    const v = norm(value);
    return exact.has(v) || patterns.some((test) => test(v));
  };
}

/** A test of a value against a pattern in which `*` stands for any run of characters (`NS-*`, `*-D`, `*`). */
export function globTest(pattern: string): (value: string) => boolean {
  if (pattern === '*') return () => true;
  if (!pattern.includes('*')) return (value) => value === pattern;
  const star = pattern.indexOf('*');
  if (star === pattern.length - 1 && pattern.indexOf('*') === pattern.lastIndexOf('*')) {
    const prefix = pattern.slice(0, -1);
    return (value) => value.startsWith(prefix);
  }
  const regex = new RegExp('^' + pattern.split('*').map((part) => part.replace(/[.+?^${}()|[\]\\]/g, '\\$&')).join('.*') + '$');
  return (value) => regex.test(value);
}

/**
 * Bracket scoring after Black et al. (1991), labelled after Magerman (1995)
 * (CHECK-VALUES §7): brackets as labelled spans of word positions, matched as
 * multisets; precision, recall, F1 and crossing brackets.
 */

/** A bracket: its label (empty for unlabelled scoring) and span, end exclusive. */
export interface Span {
  label: string;
  start: number;
  end: number;
}

/** Running totals over a corpus. */
export interface BracketTotals {
  gold: number;
  test: number;
  matched: number;
  labelledMatched: number;
  /** Test brackets that cross some gold bracket. */
  crossing: number;
  sentences: number;
  /** Sentences whose labelled brackets match exactly. */
  exact: number;
}

export function emptyTotals(): BracketTotals {
  return { gold: 0, test: 0, matched: 0, labelledMatched: 0, crossing: 0, sentences: 0, exact: 0 };
}

/** Matches as multisets: how many of `test` find a partner in `gold`. */
function matchCount(gold: Span[], test: Span[], key: (s: Span) => string): number {
  const pool = new Map<string, number>();
  for (const span of gold) pool.set(key(span), (pool.get(key(span)) ?? 0) + 1);
  let matched = 0;
  for (const span of test) {
    const left = pool.get(key(span)) ?? 0;
    if (left > 0) {
      matched++;
      pool.set(key(span), left - 1);
    }
  }
  return matched;
}

/** Two spans cross when they overlap and neither contains the other. */
export function crosses(a: Span, b: Span): boolean {
  return (a.start < b.start && b.start < a.end && a.end < b.end) || (b.start < a.start && a.start < b.end && b.end < a.end);
}

/** Adds one sentence's brackets to the totals. */
export function scoreBrackets(totals: BracketTotals, gold: Span[], test: Span[]): void {
  const unlabelled = (s: Span) => `${s.start}:${s.end}`;
  const labelled = (s: Span) => `${s.label}:${s.start}:${s.end}`;
  totals.sentences++;
  totals.gold += gold.length;
  totals.test += test.length;
  totals.matched += matchCount(gold, test, unlabelled);
  const labelledMatched = matchCount(gold, test, labelled);
  totals.labelledMatched += labelledMatched;
  totals.crossing += test.filter((t) => gold.some((g) => crosses(t, g))).length;
  if (labelledMatched === gold.length && labelledMatched === test.length) totals.exact++;
}

/** Precision, recall and F1 from totals; labelled F1 beside them. */
export function bracketScores(t: BracketTotals): { precision: number; recall: number; f1: number; labelledF1: number; crossing: number } {
  const f = (p: number, r: number) => (p + r === 0 ? 0 : (2 * p * r) / (p + r));
  const precision = t.test ? t.matched / t.test : 0;
  const recall = t.gold ? t.matched / t.gold : 0;
  const lp = t.test ? t.labelledMatched / t.test : 0;
  const lr = t.gold ? t.labelledMatched / t.gold : 0;
  return { precision, recall, f1: f(precision, recall), labelledF1: f(lp, lr), crossing: t.crossing };
}

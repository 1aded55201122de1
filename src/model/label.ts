/**
 * A phrase label split into its parts, following the bracketing conventions
 * (Bies et al. 1995, from memory; see ../shared/CHECK-VALUES.md §8):
 * `NP-SBJ-1` is category NP, function tag SBJ, coindex 1; `IP-SUB=2` is
 * category IP, function tag SUB, gapping index 2. Labels that begin and end
 * with a hyphen (`-NONE-`, `-LRB-`) are categories as a whole.
 *
 * Labels are read-only: the reader hands the same object to every node that
 * carries the same written label, as a corpus repeats a few hundred labels
 * millions of times. Build a new label to change one.
 */
export interface Label {
  /** The category: `NP`, `IP`, `-NONE-`. */
  readonly category: string;
  /** Function tags in written order: `['SBJ']`, `['LOC', 'PRD']`. */
  readonly functions: readonly string[];
  /** The coindex `n` of `-n`: this node is the antecedent of traces `*T*-n` and of gapped `=n` nodes. */
  readonly coindex?: number;
  /** The gapping index `n` of `=n`: this node is gapped with the node whose coindex is n. */
  readonly gapIndex?: number;
}

/** Only numbers written without leading zeros are indices, so that every label writes back as read. */
function isCanonicalNumber(text: string): boolean {
  return /^\d+$/.test(text) && String(Number(text)) === text;
}

const parsed = new Map<string, Label>();
const NO_TAGS: readonly string[] = Object.freeze([]);

/** Splits a written label into its parts. `formatLabel(parseLabel(s)) === s` for every label. */
export function parseLabel(written: string): Label {
  // Most tags have no hyphen and no equals sign: they are categories as they stand.
  if (written.indexOf('-') === -1 && written.indexOf('=') === -1) return { category: written, functions: NO_TAGS };
  let label = parsed.get(written);
  if (label === undefined) {
    label = Object.freeze(splitLabel(written));
    // A bound on the cache keeps a file of unique labels from holding them all.
    if (parsed.size >= 100_000) parsed.clear();
    parsed.set(written, label);
  }
  return label;
}

function splitLabel(written: string): Label {
  if (written.length > 1 && written.startsWith('-') && written.endsWith('-')) {
    return { category: written, functions: [] };
  }
  let body = written;
  let gapIndex: number | undefined;
  const equals = body.lastIndexOf('=');
  if (equals > 0 && isCanonicalNumber(body.slice(equals + 1))) {
    gapIndex = Number(body.slice(equals + 1));
    body = body.slice(0, equals);
  }
  const parts = body.split('-');
  // A leading hyphen or an empty part means the label does not follow the convention: keep it whole.
  if (parts.some((part) => part === '')) return withGap({ category: body, functions: [] }, gapIndex);
  let coindex: number | undefined;
  const last = parts[parts.length - 1]!;
  if (parts.length > 1 && isCanonicalNumber(last)) {
    coindex = Number(last);
    parts.pop();
  }
  const label: Label = coindex === undefined ? { category: parts[0]!, functions: parts.slice(1) } : { category: parts[0]!, functions: parts.slice(1), coindex };
  return withGap(label, gapIndex);
}

function withGap(label: Label, gapIndex: number | undefined): Label {
  return gapIndex === undefined ? label : { ...label, gapIndex };
}

/** Writes a label back in the bracketing convention. */
export function formatLabel(label: Label): string {
  let text = label.category;
  for (const tag of label.functions) text += '-' + tag;
  if (label.coindex !== undefined) text += '-' + label.coindex;
  if (label.gapIndex !== undefined) text += '=' + label.gapIndex;
  return text;
}

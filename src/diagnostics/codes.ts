/**
 * Every diagnostic treebridge can report, with its severity and a one-line
 * meaning. Codes are stable: tools and users match on them, so a code is never
 * renamed or reused. An error means a tree could not be read; a warning means
 * the tree was read but its annotation looks inconsistent.
 */
export const diagnosticCodes = {
  // Reading: the tree is not read.
  'unclosed-bracket': { severity: 'error', meaning: 'a bracket is opened and never closed' },
  'unmatched-close': { severity: 'error', meaning: 'a closing bracket with no tree open' },
  'text-outside-tree': { severity: 'error', meaning: 'text between trees, outside any bracket' },
  'empty-brackets': { severity: 'error', meaning: 'a bracket with neither label nor content: `()`' },
  'empty-label': { severity: 'error', meaning: 'a bracket inside a tree has no label' },
  'childless-node': { severity: 'error', meaning: 'a labelled bracket with nothing inside: `(NP)`' },
  'word-outside-preterminal': { severity: 'error', meaning: 'a word stands beside brackets instead of under a part-of-speech bracket' },
  'several-words': { severity: 'error', meaning: 'a part-of-speech bracket holds more than one word' },
  'empty-tree': { severity: 'error', meaning: 'a top-level bracket holds no sentence' },
  'misplaced-id': { severity: 'error', meaning: 'an (ID ...) node is not directly under the outer bracket, or is malformed' },
  'invalid-encoding': { severity: 'error', meaning: 'bytes that are not valid UTF-8' },
  'tree-too-large': { severity: 'error', meaning: 'a single tree is larger than the reader accepts' },
  'bad-bracketing': { severity: 'error', meaning: 'a balanced bracket that still does not parse as a tree' },
  'io-error': { severity: 'error', meaning: 'a file could not be read or written' },
  // Annotation: the tree is read.
  'several-roots': { severity: 'warning', meaning: 'the outer bracket holds more than one sentence node' },
  'trace-without-antecedent': { severity: 'warning', meaning: 'a trace points to an index no node carries' },
  'gap-without-antecedent': { severity: 'warning', meaning: 'a gapping index =n has no node with coindex n' },
  'duplicate-antecedent': { severity: 'warning', meaning: 'two nodes of one tree carry the same coindex' },
  'unreferenced-coindex': { severity: 'warning', meaning: 'a coindex that no trace or gapping index points to' },
  'duplicate-id': { severity: 'warning', meaning: 'two trees carry the same sentence identifier' },
  'missing-id': { severity: 'warning', meaning: 'a tree has no identifier while others in its file have one' },
  'no-words': { severity: 'warning', meaning: 'a tree holds no words' },
  'missing-lemma': { severity: 'warning', meaning: 'lemma splitting is on but a word has no `-lemma` part' },
} as const satisfies Record<string, { severity: 'error' | 'warning'; meaning: string }>;

/** A stable diagnostic code. */
export type DiagnosticCode = keyof typeof diagnosticCodes;

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
  // Conversion.
  'nothing-to-convert': { severity: 'warning', meaning: 'a tree without words (only empty elements or notes) is skipped' },
  'not-a-tree': { severity: 'error', meaning: 'a sentence whose heads do not form a tree cannot be bracketed' },
  'misaligned': { severity: 'warning', meaning: 'a converted sentence and its gold sentence do not have the same words' },
  // Head and label tables.
  'table-syntax': { severity: 'error', meaning: 'a line of a table that does not parse' },
  'table-invalid': { severity: 'error', meaning: 'a statement of a table that parses but makes no sense' },
  'table-not-found': { severity: 'error', meaning: 'a table named or built on that cannot be found' },
  // CoNLL-U (Universal Dependencies v2 format specification; ../shared/CHECK-VALUES.md §6).
  'wrong-column-count': { severity: 'error', meaning: 'a word line without exactly ten tab-separated columns' },
  'empty-field': { severity: 'error', meaning: 'an empty column; unspecified values are written `_`' },
  'invalid-id': { severity: 'error', meaning: 'an ID that is not a word number, a range `1-2` or an empty node `3.1`' },
  'id-sequence': { severity: 'error', meaning: 'word IDs do not run 1, 2, 3 … without gaps' },
  'bad-range': { severity: 'error', meaning: 'a multiword range that is empty, overlaps another, is not placed before its first word, or runs past the words' },
  'empty-node-sequence': { severity: 'error', meaning: 'empty nodes not numbered i.1, i.2 … after word i' },
  'multiword-fields': { severity: 'error', meaning: 'a multiword token line fills a column other than FORM and MISC' },
  'empty-node-fields': { severity: 'error', meaning: 'an empty node with HEAD or DEPREL filled, or without DEPS' },
  'invalid-head': { severity: 'error', meaning: 'HEAD is not 0 or a word number' },
  'invalid-deprel': { severity: 'error', meaning: 'DEPREL is not a relation, optionally with a `:subtype`' },
  'space-in-field': { severity: 'error', meaning: 'a space in a column other than FORM, LEMMA and MISC' },
  'not-nfc': { severity: 'error', meaning: 'text that is not in Unicode normalization form C' },
  'carriage-return': { severity: 'error', meaning: 'a line ending in CR LF; CoNLL-U lines end in LF' },
  'no-final-newline': { severity: 'error', meaning: 'the file does not end with a line feed' },
  'missing-blank-line': { severity: 'error', meaning: 'the last sentence is not followed by a blank line' },
  'extra-blank-line': { severity: 'error', meaning: 'more than one blank line between sentences' },
  'comment-after-words': { severity: 'error', meaning: 'a comment line among or after the word lines of a sentence' },
  'empty-sentence': { severity: 'error', meaning: 'a sentence with comments but no word line' },
  'missing-sent-id': { severity: 'error', meaning: 'a sentence without a `# sent_id` comment' },
  'missing-text': { severity: 'error', meaning: 'a sentence without a `# text` comment' },
  'repeated-comment': { severity: 'error', meaning: '`# sent_id` or `# text` given twice in one sentence' },
  'duplicate-sent-id': { severity: 'error', meaning: 'a sent_id used by an earlier sentence' },
  'head-out-of-range': { severity: 'error', meaning: 'HEAD names a word the sentence does not have' },
  'no-root': { severity: 'error', meaning: 'no word has HEAD 0' },
  'several-root-words': { severity: 'error', meaning: 'more than one word has HEAD 0' },
  'root-relation': { severity: 'error', meaning: 'DEPREL is `root` but HEAD is not 0, or HEAD is 0 but DEPREL is not `root`' },
  'cycle': { severity: 'error', meaning: 'words whose heads lead round in a circle instead of to the root' },
  'text-mismatch': { severity: 'error', meaning: '`# text` differs from the forms joined by their spacing (SpaceAfter=No)' },
  'unknown-relation': { severity: 'warning', meaning: 'a relation outside the declared set (default: the 37 universal relations)' },
} as const satisfies Record<string, { severity: 'error' | 'warning'; meaning: string }>;

/** A stable diagnostic code. */
export type DiagnosticCode = keyof typeof diagnosticCodes;

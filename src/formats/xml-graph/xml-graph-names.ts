/**
 * Values with a meaning of their own in treebridge's use of the XML graph
 * encoding. Elements and the attributes `id`, `word`, `lemma`, `pos`, `cat`,
 * `label`, `idref` and `root` are the encoding's; the rest are ours, and
 * other readers keep them as ordinary attributes.
 */

/** Written for a label or category that is not given. */
export const ABSENT = '--';

/** The tag of an empty element, also in files that do not mark kinds. */
export const EMPTY_POS = '-NONE-';

/** Our attribute that marks what a terminal or nonterminal stands for, when it is not a word or a phrase. */
export const KIND = 'kind';

/** `kind` of the nonterminal that stands for a bracketing's outer wrapper bracket. */
export const WRAPPER = 'wrapper';

/** `kind` of a terminal that stands for an empty element (trace, empty subject …). */
export const EMPTY = 'empty';

/** `kind` of a terminal that is a word although its tag is `-NONE-` (which would otherwise make it an empty element). */
export const WORD = 'word';

/** `kind` of a terminal that stands for a note (`CODE`, `META`) with text. */
export const NOTE = 'note';

/** `kind` of a terminal that stands for a note holding brackets, kept as bracketed text in `word`. */
export const NOTE_BRACKETS = 'note-brackets';

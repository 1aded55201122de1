/**
 * The limits every reader and writer shares, so that a tree one command accepts
 * every other command accepts too, and what one writes another reads.
 *
 * - Depth: a bracketing nested deeper than {@link MAX_TREE_DEPTH} brackets (the
 *   outer bracket and the part-of-speech bracket included), an XML graph deeper
 *   than {@link MAX_TREE_DEPTH} levels, or a dependency tree whose bracketing
 *   would be deeper, is reported and skipped. Every walk over trees is iterative,
 *   so the limit guards memory and readability, not the call stack.
 * - Size: one tree (or one XML sentence) longer than {@link MAX_TREE_LENGTH}
 *   characters is reported and skipped.
 */
export const MAX_TREE_DEPTH = 2000;

/** Longest single tree or sentence accepted, in characters (16 Mi). */
export const MAX_TREE_LENGTH = 16 * 1024 * 1024;

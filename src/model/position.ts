/**
 * Where a node stood in its source file.
 *
 * Offsets count UTF-16 code units of the decoded text, after any byte-order
 * mark, from the start of the file; `end` is exclusive. Line and column are not
 * stored on nodes: they are computed on demand from a {@link LineIndex}.
 * A node without a position is *generated*: a pass built it, no file held it.
 */
export interface Position {
  /** Offset of the first character of the node. */
  start: number;
  /** Offset just past the node's last character. */
  end: number;
}

/** A place in a file, for people: line and column are 1-based. */
export interface Point {
  /** Offset as in {@link Position}. */
  offset: number;
  /** Line number, counting from 1; a line ends at LF (a CR before it belongs to the line break). */
  line: number;
  /** Column, counting from 1, in UTF-16 code units. */
  column: number;
}

/**
 * A string that shares no memory with the text it was cut from. A slice of a
 * long string keeps the whole of it alive; a value kept for the rest of a run
 * (an identifier seen, for duplicate checks) is copied, so that memory does
 * not grow with the input read.
 */
export function ownCopy(text: string): string {
  return Buffer.from(text, 'utf8').toString('utf8');
}

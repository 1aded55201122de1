import type { PosMap } from '../tables/load-pos-map.js';

/** The pieces of one written word: words `first` to `last` (1-based), written together as `form`. */
export interface WrittenWord {
  first: number;
  last: number;
  form: string;
}

/** What the output makes of each leaf: the form it writes, and the written words that join several. */
export interface Surface {
  /** FORM of each word: escapes undone, join markers taken off the pieces. */
  forms: string[];
  /** LEMMA of each word (escapes undone), or undefined. */
  lemmas: Array<string | undefined>;
  /** Runs of pieces that make one written word, in order. */
  written: WrittenWord[];
}

/**
 * The surface of the words: the scheme's bracket escapes become the
 * characters again (`-LRB-` → `(`), and pieces of one written word, marked at
 * their join (`tungur$ $nar`, with marker `$`), lose the marker and are
 * grouped under the written word they make (`tungurnar`). A piece ends a
 * group when it carries no marker at its end or the next word none at its start.
 */
export function joinWrittenWords(forms: readonly string[], lemmas: ReadonlyArray<string | undefined>, map: PosMap | undefined): Surface {
  const out: Surface = {
    forms: forms.map((form) => map?.unescape(form) ?? form),
    lemmas: lemmas.map((lemma) => (lemma === undefined ? undefined : (map?.unescape(lemma) ?? lemma))),
    written: [],
  };
  const marker = map?.joinMarker;
  if (!marker) return out;
  const endsJoined = (form: string) => form.length > marker.length && form.endsWith(marker);
  const startsJoined = (form: string) => form.length > marker.length && form.startsWith(marker);
  let i = 0;
  while (i < forms.length) {
    let j = i;
    while (j + 1 < forms.length && endsJoined(forms[j]!) && startsJoined(forms[j + 1]!)) j++;
    if (j > i) {
      for (let k = i; k <= j; k++) {
        let piece = out.forms[k]!;
        if (k > i && piece.startsWith(marker)) piece = piece.slice(marker.length);
        if (k < j && piece.endsWith(marker)) piece = piece.slice(0, -marker.length);
        out.forms[k] = piece;
      }
      out.written.push({ first: i + 1, last: j + 1, form: out.forms.slice(i, j + 1).join('') });
    }
    i = j + 1;
  }
  return out;
}

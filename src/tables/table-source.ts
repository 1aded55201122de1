/**
 * Where tables come from: the shipped ones in `headrules/` by name, or any
 * file by path, read with a bound on size. Shared by head, label, POS-map and
 * category tables, so that every kind is found, bounded and reported alike.
 */
import { closeSync, existsSync, fstatSync, openSync, readdirSync, readSync, statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Diagnostic } from '../diagnostics/diagnostic.js';

/** The kinds of table, by the extension of their files in `headrules/`. */
export type TableKind = 'heads' | 'labels' | 'pos' | 'categories' | 'features';

/** What each kind is called in messages. */
export const tableKindNames: Record<TableKind, string> = { heads: 'head table', labels: 'label table', pos: 'POS map', categories: 'category table', features: 'feature inventory' };

/** Largest table file read (1 MiB): shipped tables are a few KiB; a learned one stays far below. */
export const MAX_TABLE_BYTES = 1024 * 1024;

/** The shipped tables: headrules/ at the package root (two levels up from src/tables and from dist/src/tables). */
export function headrulesFolder(): string {
  const here = dirname(fileURLToPath(import.meta.url));
  for (const up of ['../..', '../../..']) {
    const folder = resolve(here, up, 'headrules');
    if (existsSync(folder)) return folder;
  }
  return resolve(here, '../../headrules');
}

/** A table that cannot be loaded: every problem found in it, or one message when it was not found at all. */
export class TableError extends Error {
  constructor(
    readonly diagnostics: Diagnostic[],
    /** Set when there is no file to point into (a name that names no table): the whole message. */
    readonly plain?: string,
  ) {
    super(plain ?? diagnostics.map((d) => `${d.file}:${d.line}:${d.column}: ${d.message}`).join('\n'));
  }
}

/** Names of the shipped tables of a kind, sorted. */
export function shippedTables(kind: TableKind): string[] {
  try {
    return readdirSync(headrulesFolder())
      .filter((name) => name.endsWith(`.${kind}`))
      .map((name) => name.slice(0, -kind.length - 1))
      .sort();
  } catch {
    return [];
  }
}

function isFile(path: string): boolean {
  try {
    return !statSync(path).isDirectory();
  } catch {
    return false;
  }
}

/**
 * Finds a table: a path (relative to the table that names it, when `from` is
 * given, else to the working folder), with or without the kind's extension,
 * else a shipped table of that name.
 */
export function findTable(nameOrPath: string, kind: TableKind, from?: string): string | undefined {
  const candidates = [
    ...(from ? [resolve(dirname(from), nameOrPath), resolve(dirname(from), `${nameOrPath}.${kind}`)] : []),
    resolve(nameOrPath),
    join(headrulesFolder(), `${nameOrPath}.${kind}`),
  ];
  return candidates.find(isFile);
}

/** The edit distance of two names, for suggesting the nearest shipped table. */
function distance(a: string, b: string): number {
  const row = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    let diagonal = row[0]!;
    row[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const above = row[j]!;
      row[j] = Math.min(row[j]! + 1, row[j - 1]! + 1, diagonal + (a[i - 1] === b[j - 1] ? 0 : 1));
      diagonal = above;
    }
  }
  return row[b.length]!;
}

/** The message for a name that names no table: what is shipped, and the nearest name when one is close. */
export function notFoundMessage(nameOrPath: string, kind: TableKind): string {
  const shipped = shippedTables(kind);
  const ranked = shipped.map((name) => ({ name, d: distance(nameOrPath.toLowerCase(), name.toLowerCase()) })).sort((a, b) => a.d - b.d);
  const near = ranked[0] && ranked[0].d <= Math.max(2, Math.floor(nameOrPath.length / 3)) ? `; did you mean "${ranked[0].name}"?` : '';
  const list = shipped.length > 0 ? `; shipped ${tableKindNames[kind]}s: ${shipped.join(', ')}` : '';
  return `no ${tableKindNames[kind]} "${nameOrPath}": no such file, and no shipped one by that name${list}${near}`;
}

/** Finds a table or throws a {@link TableError} that lists the shipped ones. */
export function requireTable(nameOrPath: string, kind: TableKind): string {
  const path = findTable(nameOrPath, kind);
  if (!path) throw new TableError([], notFoundMessage(nameOrPath, kind));
  return path;
}

/**
 * Reads a table file as UTF-8, at most {@link MAX_TABLE_BYTES}: a larger file
 * (or an endless one, such as a device) is refused with a message rather than
 * read into memory.
 */
export function readTableText(path: string, kind: TableKind): string {
  let fd: number;
  try {
    fd = openSync(path, 'r');
  } catch (error) {
    throw new TableError([], `cannot read ${tableKindNames[kind]} "${path}": ${(error as Error).message}`);
  }
  try {
    if (fstatSync(fd).isDirectory()) throw new TableError([], `cannot read ${tableKindNames[kind]} "${path}": it is a folder`);
    const buffer = Buffer.alloc(MAX_TABLE_BYTES + 1);
    let filled = 0;
    while (filled < buffer.length) {
      const got = readSync(fd, buffer, filled, buffer.length - filled, null);
      if (got === 0) break;
      filled += got;
    }
    if (filled > MAX_TABLE_BYTES) throw new TableError([], `${tableKindNames[kind]} "${path}" is larger than ${MAX_TABLE_BYTES / 1024} KiB, more than any table needs; not read`);
    return buffer.subarray(0, filled).toString('utf8');
  } finally {
    closeSync(fd);
  }
}

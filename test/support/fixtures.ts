import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { expect } from 'vitest';

/**
 * Compares written text with an expected fixture file. With UPDATE=1 a
 * differing file is rewritten, and the test still fails, printing what
 * changed, so that a regeneration is always looked at before it is committed
 * (run again to see it pass).
 */
export function expectFixture(path: string, written: string): void {
  const expected = existsSync(path) ? readFileSync(path, 'utf8') : undefined;
  if (process.env.UPDATE && written !== expected) {
    writeFileSync(path, written);
    throw new Error(`UPDATE=1 rewrote ${path}; review the change and run the tests again:\n${lineDiff(expected ?? '', written)}`);
  }
  expect(written).toBe(expected);
}

/** The lines that differ, marked - (old) and + (new), at most 40. */
function lineDiff(before: string, after: string): string {
  const a = before.split('\n');
  const b = after.split('\n');
  const out: string[] = [];
  for (let i = 0; i < Math.max(a.length, b.length) && out.length < 40; i++) {
    if (a[i] === b[i]) continue;
    if (a[i] !== undefined) out.push(`- ${i + 1}: ${a[i]}`);
    if (b[i] !== undefined) out.push(`+ ${i + 1}: ${b[i]}`);
  }
  return out.join('\n');
}

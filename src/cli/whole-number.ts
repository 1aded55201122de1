import { InvalidArgumentError } from 'commander';

/** Option parser for counts: a whole number from `least` up, else a usage error (exit 2). */
export function wholeNumber(least: number): (value: string) => number {
  return (value) => {
    if (!/^\d+$/.test(value) || Number(value) < least) throw new InvalidArgumentError(`expected a whole number of at least ${least}, got "${value}"`);
    return Number(value);
  };
}

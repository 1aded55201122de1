import { existsSync, readFileSync } from 'node:fs';

/** The package version, from package.json (one level up from src/, two from dist/src/, three from the command's bundle in dist/src/bin/). */
function readVersion(): string {
  for (const relative of ['../package.json', '../../package.json', '../../../package.json']) {
    const url = new URL(relative, import.meta.url);
    if (!existsSync(url)) continue;
    const pkg = JSON.parse(readFileSync(url, 'utf8')) as { name?: string; version?: string };
    if (pkg.name === 'treebridge' && pkg.version) return pkg.version;
  }
  return '0.0.0';
}

export const version: string = readVersion();

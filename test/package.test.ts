import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { projectRoot } from './support/corpora.js';

// What `npm pack` would put in the package, asked of npm itself (nothing is written).
function packedFiles(): string[] {
  const npm = process.platform === 'win32' ? 'npm.cmd' : 'npm';
  const out = execFileSync(npm, ['pack', '--dry-run', '--json', '--ignore-scripts'], { cwd: projectRoot, encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] });
  const [pack] = JSON.parse(out) as Array<{ files: Array<{ path: string }> }>;
  return pack!.files.map((file) => file.path);
}

describe('the package', () => {
  const files = packedFiles();

  it('holds the built library and command, the grammars, the tables, the README and the licence', () => {
    for (const file of ['package.json', 'README.md', 'LICENSE', 'dist/src/index.js', 'dist/src/index.d.ts', 'dist/src/cli/index.js', 'dist/src/bin/treebridge.js', 'grammars/bracketed.peggy', 'headrules/en-content.heads', 'headrules/ud.features']) {
      expect(files, file).toContain(file);
    }
  });

  it('holds no tests, benchmarks, examples, sources or demo data', () => {
    const allowed = /^(package\.json|README\.md|LICENSE|dist\/src\/.+|grammars\/[^/]+\.peggy|headrules\/[^/]+)$/;
    expect(files.filter((file) => !allowed.test(file))).toEqual([]);
    expect(files.filter((file) => /(^|\/)(test|bench|examples|demo-data)\//.test(file))).toEqual([]);
  });
});

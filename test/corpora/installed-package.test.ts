// The package as a user gets it: packed by npm, installed from the tarball in an
// empty folder (its dependencies come from the registry, as for any user), then
// the command and the README's library example run from there.
import { execFileSync } from 'node:child_process';
import { copyFileSync, mkdtempSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { projectRoot } from '../support/corpora.js';

const npm = process.platform === 'win32' ? 'npm.cmd' : 'npm';
const npx = process.platform === 'win32' ? 'npx.cmd' : 'npx';

describe('the installed package', () => {
  it('runs the command and the library example after npm install of the packed tarball', () => {
    const packs = mkdtempSync(join(tmpdir(), 'treebridge-pack-'));
    execFileSync(npm, ['pack', '--ignore-scripts', '--pack-destination', packs], { cwd: projectRoot, stdio: 'ignore' });
    const [tarball] = readdirSync(packs).filter((name) => name.endsWith('.tgz'));
    expect(tarball).toBeDefined();

    const user = mkdtempSync(join(tmpdir(), 'treebridge-user-'));
    writeFileSync(join(user, 'package.json'), JSON.stringify({ name: 'a-user', private: true, type: 'module' }));
    execFileSync(npm, ['install', '--no-audit', '--no-fund', join(packs, tarball!)], { cwd: user, stdio: 'ignore' });

    const help = execFileSync(npx, ['treebridge', '--help'], { cwd: user, encoding: 'utf8' });
    expect(help).toContain('to-deps');

    copyFileSync(join(projectRoot, 'dist/examples/convert-a-string.js'), join(user, 'convert.js'));
    const conllu = execFileSync(process.execPath, ['convert.js'], { cwd: user, encoding: 'utf8' });
    expect(conllu).toMatch(/^# sent_id = ferry\.1\n/);
    expect(conllu).toContain('\tferry\t_\tNOUN\tNN\tNumber=Sing\t3\tnsubj\t');
  });
});

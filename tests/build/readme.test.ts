import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { ROOT } from './helpers.ts';

// Issue 8: the README's set-up commands must work on a fresh clone, and CI must
// run exactly those commands, so that CI fails whenever a newcomer would.
function setupCommands(): string[] {
  const readme = readFileSync(join(ROOT, 'README.md'), 'utf8');
  const section = readme.split(/^## /m).find((s) => s.startsWith('Set-up'));
  if (!section) throw new Error('README.md has no "## Set-up" section');
  const block = /```sh\n([\s\S]*?)```/.exec(section)?.[1] ?? '';
  return block
    .split('\n')
    .map((l) => l.replace(/\s+#.*$/, '').trim())
    .filter(Boolean);
}

describe('the README set-up', () => {
  it('gives two commands, and .ci/run runs each of them verbatim', () => {
    const commands = setupCommands();
    expect(commands).toHaveLength(2);
    const ci = readFileSync(join(ROOT, '.ci/run'), 'utf8').split('\n').map((l) => l.trim());
    for (const c of commands) expect(ci).toContain(c);
  });

  it('npm scripts never call the package by its own bin name (npm does not link it for the package itself)', () => {
    const pkg = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')) as { scripts: Record<string, string>; bin: Record<string, string> };
    for (const name of Object.keys(pkg.bin)) {
      for (const [script, cmd] of Object.entries(pkg.scripts)) {
        expect(cmd.split(/&&|\|\||;/).map((c) => c.trim().split(/\s+/)[0]), `script "${script}"`).not.toContain(name);
      }
    }
  });
});

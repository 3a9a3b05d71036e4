#!/usr/bin/env node
// The `vitrine` command. The pipeline is TypeScript run directly by Node's
// type stripping (Node >= 22.18). On an older system Node, re-run this file
// with the Node that the project pins in its devDependencies.
import { spawnSync } from 'node:child_process';
import { createRequire } from 'node:module';

const [major, minor] = process.versions.node.split('.').map(Number);
const modern = major > 22 || (major === 22 && minor >= 18);

if (!modern) {
  let pinned;
  try {
    pinned = createRequire(import.meta.url).resolve('node/bin/node');
  } catch {
    console.error(
      `vitrine needs Node 22.18 or newer (this is ${process.version}). Run it through npm (npm run build, npx vitrine …) so the project's pinned Node is used, or install Node 24.`,
    );
    process.exit(2);
  }
  const r = spawnSync(pinned, [new URL(import.meta.url).pathname, ...process.argv.slice(2)], { stdio: 'inherit' });
  process.exit(r.status ?? 1);
} else {
  // Node keeps compiled modules (and our TypeScript with its types stripped) on disk, as
  // Astro's and Vite's own commands do: a rebuild does not compile the same code again.
  (await import('node:module')).enableCompileCache?.();
  const { main } = await import('../pipeline/cli.ts');
  process.exitCode = await main(process.argv.slice(2));
}

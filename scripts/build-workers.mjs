#!/usr/bin/env node
/**
 * Bundle the worker-thread entry points with their pure src/lib imports into dist/workers/,
 * so a built server can start them without TypeScript tooling.
 * Usage: node scripts/build-workers.mjs [outdir]   (run after `astro build`, which empties dist/)
 */
import { build } from 'esbuild';
import { fileURLToPath } from 'node:url';
import { dirname, join, resolve } from 'node:path';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');

/** Build every worker; returns the output directory. */
export async function buildWorkers(outdir = join(root, 'dist', 'workers')) {
  await build({
    entryPoints: { 'fit-worker': join(root, 'src/server/fit-worker.ts') },
    outdir,
    outExtension: { '.js': '.mjs' },
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    sourcemap: true,
    logLevel: 'warning',
  });
  return outdir;
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const out = await buildWorkers(process.argv[2] ? resolve(process.argv[2]) : undefined);
  console.log(`workers built in ${out}`);
}

/**
 * Initial route JavaScript: builds the front end into a temporary folder with Vite's manifest and adds up,
 * gzipped, the entry chunk and every chunk it imports statically — what a browser must fetch before the
 * first page renders. Lazy (dynamic) imports are not counted.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import type { BenchRow } from '../run.js';

interface ManifestChunk {
  file: string;
  isEntry?: boolean;
  imports?: string[];
}

const root = path.resolve(import.meta.dirname, '..', '..');

export default async function initialBundle(): Promise<BenchRow[]> {
  const outDir = mkdtempSync(path.join(os.tmpdir(), 'cleancase-bundle-'));
  try {
    const built = spawnSync(
      path.join(root, 'node_modules', '.bin', 'vite'),
      ['build', '--logLevel', 'error', '--manifest', '--outDir', outDir, '--emptyOutDir'],
      {
        cwd: root,
        stdio: ['ignore', 'ignore', 'inherit'],
      },
    );
    if (built.status !== 0) throw new Error('vite build failed');
    const manifest = JSON.parse(readFileSync(path.join(outDir, '.vite', 'manifest.json'), 'utf8')) as Record<string, ManifestChunk>;
    const seen = new Set<string>();
    const visit = (key: string) => {
      if (seen.has(key)) return;
      seen.add(key);
      for (const next of manifest[key]?.imports ?? []) visit(next);
    };
    for (const [key, chunk] of Object.entries(manifest)) if (chunk.isEntry) visit(key);
    let gzipBytes = 0;
    for (const key of seen) {
      const file = manifest[key]?.file;
      if (file?.endsWith('.js')) gzipBytes += gzipSync(readFileSync(path.join(outDir, file)), { level: 9 }).length;
    }
    return [
      {
        name: 'front end: initial route JavaScript (entry + static imports, gzip)',
        value: gzipBytes / 1024,
        unit: 'KB',
        target: { value: 120, higherIsBetter: false },
      },
    ];
  } finally {
    rmSync(outDir, { recursive: true, force: true });
  }
}

import fs from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';

/**
 * What each page of the built client costs to load, from Vite's manifest: a page's JavaScript
 * is its route chunk with every chunk it imports statically, plus the entry. Sizes are gzip at
 * level 9, of the files as served.
 */

export const BUDGET = {
  /** The sign-in page, everything included (kB of gzipped JavaScript). */
  signInKb: 150,
  /** A route's own chunk (what opening that page adds). */
  routeChunkKb: 120,
};

interface ManifestChunk {
  file: string;
  src?: string;
  isEntry?: boolean;
  isDynamicEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
}
type Manifest = Record<string, ManifestChunk>;

export interface BundleReport {
  entryKb: number;
  signInKb: number;
  routes: { page: string; ownKb: number; totalKb: number }[];
}

const kb = (bytes: number) => Math.round((bytes / 1024) * 10) / 10;

export function bundleReport(dist: string): BundleReport {
  const manifest = JSON.parse(fs.readFileSync(path.join(dist, '.vite', 'manifest.json'), 'utf8')) as Manifest;
  const sizes = new Map<string, number>();
  const gz = (file: string) => {
    let n = sizes.get(file);
    if (n === undefined) {
      n = gzipSync(fs.readFileSync(path.join(dist, file)), { level: 9 }).length;
      sizes.set(file, n);
    }
    return n;
  };
  /** Files a chunk needs before it runs: itself and its static imports, transitively. */
  const closure = (key: string, seen = new Set<string>()): Set<string> => {
    const c = manifest[key];
    if (!c || seen.has(c.file)) return seen;
    seen.add(c.file);
    for (const i of c.imports ?? []) closure(i, seen);
    return seen;
  };
  const sum = (files: Iterable<string>) => [...files].filter((f) => f.endsWith('.js')).reduce((n, f) => n + gz(f), 0);
  const entryKey = Object.keys(manifest).find((k) => manifest[k].isEntry)!;
  const entry = closure(entryKey);
  const pages = Object.entries(manifest).filter(([, c]) => c.isDynamicEntry && c.src?.includes('/app/'));
  const total = (keys: string[]) => {
    const files = new Set(entry);
    for (const k of keys) for (const f of closure(k)) files.add(f);
    return sum(files);
  };
  const key = (suffix: string) => pages.find(([k]) => k.endsWith(suffix))?.[0];
  const signIn = [key('layout/auth-layout.tsx'), key('routes/sign-in.tsx')].filter((k): k is string => Boolean(k));
  return {
    entryKb: kb(sum(entry)),
    signInKb: kb(total(signIn)),
    routes: pages
      .map(([k, c]) => ({ page: path.basename(c.src ?? k).replace(/\.tsx?$/, ''), ownKb: kb(gz(c.file)), totalKb: kb(total([k])) }))
      .sort((a, b) => b.totalKb - a.totalKb),
  };
}

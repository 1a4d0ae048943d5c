// Shared by start, dev, reset and test: install what is missing, run the
// project's own PostgreSQL, spawn child processes and stop everything on exit.
import { spawn, spawnSync } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensurePgBin, startCluster } from './postgres.mjs';

export const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

/** `npm ci` when node_modules is missing or older than the lockfile. */
export function ensureDependencies() {
  const marker = path.join(root, 'node_modules', '.package-lock.json');
  const lock = path.join(root, 'package-lock.json');
  const stale = !fs.existsSync(marker) || fs.statSync(marker).mtimeMs < fs.statSync(lock).mtimeMs;
  if (!stale) return;
  console.log('Installing dependencies (npm ci)…');
  const r = spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root, stdio: 'inherit' });
  if (r.status !== 0) {
    console.error('npm ci failed');
    process.exit(1);
  }
}

/** Debian's Chromium for the browser tests, installed with apt-get when root. */
export function ensureChromium() {
  if (fs.existsSync('/usr/bin/chromium')) return true;
  if (!isRoot) {
    console.error('Chromium not found at /usr/bin/chromium. Install it with:\n  sudo sh -c "apt-get update && apt-get install -y chromium"');
    return false;
  }
  console.log('Installing Chromium from Debian packages…');
  const r = spawnSync('sh', ['-c', 'apt-get update && DEBIAN_FRONTEND=noninteractive apt-get install -y chromium'], { stdio: 'inherit' });
  return r.status === 0 && fs.existsSync('/usr/bin/chromium');
}

function traversableByPostgres(dir) {
  if (!isRoot) return true;
  return spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-x', dir]).status === 0;
}

/** The product's own cluster in .data/postgres on PGPORT (default 54329). */
export function startAppCluster() {
  const bin = ensurePgBin();
  let base = path.join(root, '.data', 'postgres');
  fs.mkdirSync(path.join(root, '.data'), { recursive: true });
  if (!traversableByPostgres(path.join(root, '.data'))) {
    // The checkout sits below a folder the postgres user cannot enter.
    const tag = crypto.createHash('sha1').update(root).digest('hex').slice(0, 8);
    base = path.join('/var/tmp', `tamp-and-tally-${tag}`, 'postgres');
    fs.mkdirSync(path.dirname(base), { recursive: true, mode: 0o755 });
    console.log(`Note: PostgreSQL data kept in ${base} (the checkout is not readable by the postgres user).`);
  }
  const port = Number(process.env.PGPORT ?? 54329);
  const cluster = startCluster({ bin, baseDir: base, port });
  cluster.createDatabase('tamp');
  return { cluster, databaseUrl: cluster.urlFor('tamp') };
}

export function bin(name) {
  return path.join(root, 'node_modules', '.bin', name);
}

export function run(cmd, args, env = {}) {
  const r = spawnSync(cmd, args, { cwd: root, stdio: 'inherit', env: { ...process.env, ...env } });
  return r.status ?? 1;
}

/** Starts a child in its own process group so it and its children can be stopped together. */
export function startChild(name, cmd, args, env = {}) {
  const child = spawn(cmd, args, { cwd: root, stdio: 'inherit', env: { ...process.env, ...env }, detached: true });
  child.on('exit', (code, signal) => {
    if (!stopping) {
      console.error(`${name} exited (${signal ?? code}); stopping.`);
      void stopAll(1);
    }
  });
  children.push(child);
  return child;
}

const children = [];
const cleanups = [];
let stopping = false;

export function onStop(fn) {
  cleanups.push(fn);
}

export async function stopAll(code = 0) {
  if (stopping) return;
  stopping = true;
  for (const c of children) {
    try { process.kill(-c.pid, 'SIGTERM'); } catch { /* already gone */ }
  }
  await Promise.all(children.map((c) => (c.exitCode !== null || c.signalCode !== null ? null : new Promise((res) => {
    const t = setTimeout(() => { try { process.kill(-c.pid, 'SIGKILL'); } catch { /* gone */ } res(); }, 5000);
    c.once('exit', () => { clearTimeout(t); res(); });
  }))));
  for (const fn of cleanups.reverse()) {
    try { fn(); } catch (err) { console.error(err); }
  }
  process.exit(code);
}

export function stopOnSignals() {
  for (const s of ['SIGINT', 'SIGTERM', 'SIGHUP']) process.on(s, () => void stopAll(0));
}

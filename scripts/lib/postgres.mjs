// Managing a PostgreSQL cluster of the project's own, from Debian's packages.
// Plain Node with no dependencies: `npm start` uses it before `npm ci` has run.
import { execFileSync, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
export const DB_SUPERUSER = 'app';
const OS_USER = 'postgres';

/** Finds the server binaries (initdb, pg_ctl) or returns null. */
export function findPgBin() {
  const candidates = [];
  try {
    candidates.push(execFileSync('pg_config', ['--bindir'], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] }).trim());
  } catch { /* pg_config absent */ }
  const root = '/usr/lib/postgresql';
  if (fs.existsSync(root)) {
    for (const v of fs.readdirSync(root).sort((a, b) => Number(b) - Number(a))) candidates.push(path.join(root, v, 'bin'));
  }
  return candidates.find((dir) => fs.existsSync(path.join(dir, 'initdb')) && fs.existsSync(path.join(dir, 'pg_ctl'))) ?? null;
}

/** Finds the binaries, installing Debian's `postgresql` package when root. Exits with the command to run otherwise. */
export function ensurePgBin() {
  let bin = findPgBin();
  if (bin) return bin;
  const cmd = 'apt-get update && apt-get install -y postgresql';
  if (!isRoot) {
    console.error(`PostgreSQL server binaries not found. Install them with:\n  sudo sh -c '${cmd}'`);
    process.exit(1);
  }
  console.log('Installing PostgreSQL from Debian packages…');
  const r = spawnSync('sh', ['-c', `DEBIAN_FRONTEND=noninteractive ${cmd}`], { stdio: 'inherit' });
  if (r.status !== 0) { console.error('apt-get failed'); process.exit(1); }
  // Debian's package creates and starts a system cluster on 5432; we never use it.
  bin = findPgBin();
  if (!bin) { console.error('PostgreSQL installed but binaries not found'); process.exit(1); }
  return bin;
}

function asDbUser(cmd, args, opts = {}) {
  if (isRoot) return spawnSync('runuser', ['-u', OS_USER, '--', cmd, ...args], { encoding: 'utf8', ...opts });
  return spawnSync(cmd, args, { encoding: 'utf8', ...opts });
}

function check(r, what) {
  if (r.status !== 0) throw new Error(`${what} failed (${r.status}): ${r.stderr || r.stdout}`);
  return r;
}

/** Gives a folder to the unprivileged OS user when running as root. */
function own(dir) {
  if (isRoot) execFileSync('chown', ['-R', `${OS_USER}:${OS_USER}`, dir]);
}

export async function freePort() {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.unref();
    srv.on('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address();
      srv.close(() => resolve(port));
    });
  });
}

/**
 * Creates (when missing) and starts a cluster in `baseDir`: data in baseDir/data,
 * socket and log in baseDir. Returns {url(db), stop()}.
 */
export function startCluster({ bin, baseDir, port, throwaway = false }) {
  fs.mkdirSync(baseDir, { recursive: true });
  fs.chmodSync(baseDir, 0o700);
  own(baseDir);
  const dataDir = path.join(baseDir, 'data');
  if (!fs.existsSync(path.join(dataDir, 'PG_VERSION'))) {
    check(asDbUser(path.join(bin, 'initdb'), ['-D', dataDir, '-U', DB_SUPERUSER, '--auth=trust', '-E', 'UTF8', '--no-locale', ...(throwaway ? ['--no-sync'] : [])]), 'initdb');
  }
  const opts = [`-c listen_addresses=127.0.0.1`, `-p ${port}`, `-k ${baseDir}`];
  if (throwaway) opts.push('-c fsync=off', '-c synchronous_commit=off', '-c full_page_writes=off');
  const logFile = path.join(baseDir, 'server.log');
  // A cluster left running by an earlier crash is stopped first.
  if (fs.existsSync(path.join(dataDir, 'postmaster.pid'))) {
    asDbUser(path.join(bin, 'pg_ctl'), ['-D', dataDir, '-m', 'fast', '-w', 'stop']);
  }
  check(asDbUser(path.join(bin, 'pg_ctl'), ['-D', dataDir, '-l', logFile, '-w', '-t', '60', '-o', opts.join(' '), 'start']), 'pg_ctl start');
  let stopped = false;
  return {
    port,
    dataDir,
    urlFor: (db) => `postgres://${DB_SUPERUSER}@127.0.0.1:${port}/${db}`,
    createDatabase(db) {
      const r = asDbUser(path.join(bin, 'createdb'), ['-h', '127.0.0.1', '-p', String(port), '-U', DB_SUPERUSER, db]);
      if (r.status !== 0 && !/already exists/.test(r.stderr)) throw new Error(`createdb failed: ${r.stderr}`);
    },
    dropDatabase(db) {
      asDbUser(path.join(bin, 'dropdb'), ['-h', '127.0.0.1', '-p', String(port), '-U', DB_SUPERUSER, '--if-exists', '--force', db]);
    },
    stop({ remove = throwaway } = {}) {
      if (stopped) return;
      stopped = true;
      asDbUser(path.join(bin, 'pg_ctl'), ['-D', dataDir, '-m', throwaway ? 'immediate' : 'fast', '-w', 'stop']);
      if (remove) fs.rmSync(baseDir, { recursive: true, force: true });
    },
  };
}

/** A throwaway cluster in a fresh temporary folder on a free port. */
export async function startThrowawayCluster() {
  const bin = ensurePgBin();
  const baseDir = fs.mkdtempSync(path.join(os.tmpdir(), 'tamp-pg-'));
  const port = await freePort();
  try {
    return startCluster({ bin, baseDir, port, throwaway: true });
  } catch (err) {
    fs.rmSync(baseDir, { recursive: true, force: true });
    throw err;
  }
}

// npm test: every check — typecheck and lint side by side, then the client build, then vitest
// (unit, API and browser tests; the tests start their own PostgreSQL and fakes).
import { spawn } from 'node:child_process';
import { bin, ensureChromium, ensureDependencies, root, run } from './lib/stack.mjs';

ensureDependencies();
if (!ensureChromium()) process.exit(1);

const env = { ...process.env, NODE_ENV: 'test' };

/** Runs a step, its output kept until it ends so two steps side by side do not interleave. */
function step(name, cmd, args) {
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { cwd: root, env });
    let out = '';
    child.stdout.on('data', (d) => (out += d));
    child.stderr.on('data', (d) => (out += d));
    child.on('close', (code) => {
      console.log(`\n▶ ${name}${code === 0 ? '' : ' — failed'}`);
      if (out.trim()) console.log(out.trimEnd());
      resolve(code ?? 1);
    });
  });
}

// The native TypeScript compiler (7.x) typechecks; ESLint's TypeScript support loads the 6.x API.
const checks = await Promise.all([
  step('typecheck', bin('tsc'), ['-p', 'tsconfig.json']),
  step('lint', bin('eslint'), ['.', '--max-warnings', '0', '--cache', '--cache-location', 'node_modules/.cache/eslint/']),
]);
if (checks.some((c) => c !== 0)) {
  console.error('✖ typecheck or lint failed');
  process.exit(1);
}
// The client is built as it ships (NODE_ENV=test would give React's development build).
for (const [name, cmd, args, nodeEnv] of [
  ['build', bin('vite'), ['build', '--logLevel', 'warn'], 'production'],
  ['tests', bin('vitest'), ['run', ...process.argv.slice(2)], 'test'],
]) {
  console.log(`\n▶ ${name}`);
  const code = run(cmd, args, { NODE_ENV: nodeEnv });
  if (code !== 0) {
    console.error(`✖ ${name} failed`);
    process.exit(code);
  }
}

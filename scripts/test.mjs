// npm test: every check, in order — typecheck, lint, client build, then vitest
// (unit, API and browser tests; the tests start their own PostgreSQL and fakes).
import { bin, ensureChromium, ensureDependencies, run } from './lib/stack.mjs';

ensureDependencies();
if (!ensureChromium()) process.exit(1);
const steps = [
  ['typecheck', bin('tsc'), ['-p', 'tsconfig.json']],
  ['lint', bin('eslint'), ['.', '--max-warnings', '0']],
  ['build', bin('vite'), ['build', '--logLevel', 'warn']],
  ['tests', bin('vitest'), ['run', ...process.argv.slice(2)]],
];
for (const [name, cmd, args] of steps) {
  console.log(`\n▶ ${name}`);
  const code = run(cmd, args, { NODE_ENV: 'test' });
  if (code !== 0) {
    console.error(`✖ ${name} failed`);
    process.exit(code);
  }
}

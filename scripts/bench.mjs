// npm run bench: performance figures measured in one run on a scratch
// PostgreSQL cluster (see scripts/bench/index.ts). Not a test: it prints.
import { bin, ensureDependencies, run } from './lib/stack.mjs';

ensureDependencies();
process.exit(run(bin('tsx'), ['scripts/bench/index.ts', ...process.argv.slice(2)], { NODE_ENV: 'test' }));

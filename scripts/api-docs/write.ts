// npm run docs:api — writes the README's list of endpoints from the contract.
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { CONTRACT } from '../../src/shared/contract/registry';
import { withApi } from './render';

const readme = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../README.md');
fs.writeFileSync(readme, withApi(fs.readFileSync(readme, 'utf8'), CONTRACT));
console.log(`README.md: ${CONTRACT.length} endpoints written.`);

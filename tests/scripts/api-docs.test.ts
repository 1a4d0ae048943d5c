import fs from 'node:fs';
import { expect, test } from 'vitest';
import { CONTRACT } from '../../src/shared/contract/registry';
import { withApi } from '../../scripts/api-docs/render';

test("the README's list of endpoints is the contract's (run `npm run docs:api` after changing an endpoint)", () => {
  const readme = fs.readFileSync(new URL('../../README.md', import.meta.url), 'utf8');
  expect(readme).toBe(withApi(readme, CONTRACT));
});

import { afterEach, beforeEach, vi } from 'vitest';

// A console.error in a test fails it: errors are never silently logged.
let errors: unknown[][] = [];
beforeEach(() => {
  errors = [];
  vi.spyOn(console, 'error').mockImplementation((...args: unknown[]) => {
    errors.push(args);
  });
});
afterEach(() => {
  if (errors.length > 0) {
    const first = errors[0].map(String).join(' ');
    throw new Error(`console.error was called ${errors.length} time(s): ${first}`);
  }
});

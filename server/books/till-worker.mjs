// The worker thread's entry (plain JavaScript, as a worker is started by Node itself): it loads
// the TypeScript task through tsx, which runs the server, and answers each task with its result.
import { tsImport } from 'tsx/esm/api';

const task = tsImport('./till-task.ts', import.meta.url);

export default async function run(input) {
  return (await task).runTillTask(input);
}

// Entry of a takeoff pool worker thread. The server runs TypeScript through tsx, and a worker
// thread does not inherit the main thread's loader, so it registers tsx itself first.
import { register } from 'tsx/esm/api';

register();
const { runPlanTask } = await import('./plan-task.ts');

export default runPlanTask;

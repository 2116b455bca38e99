// Worker-thread entry of the geometry pool. Worker threads start without the parent's loaders
// (the pool passes no execArgv), so TypeScript support is registered here before the tasks load;
// this works the same under `node --import tsx`, vitest and the bench.
import { register } from 'tsx/esm/api';

register();
const { runGeometryTask } = await import('./geometry-tasks.ts');

export default runGeometryTask;

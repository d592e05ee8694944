// Worker-thread entry: teach this thread TypeScript (jest's transformer does not reach
// worker threads), then load the task handler.
require('tsx/cjs/api').register();
require('./classical-worker.ts');

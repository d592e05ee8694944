// Worker-thread entry for one solve slot: teach this thread TypeScript (tsx), then load the
// handler. Kept apart from pure engine code, which never imports worker_threads.
require('tsx/cjs/api').register();
require('./solve-thread.ts');

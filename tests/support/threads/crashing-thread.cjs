// A solve-thread entry that crashes the way a broken module load does: an uncaught error whose
// text names a server file (thread-slot must keep that text out of what members see).
require('node:worker_threads').parentPort.on('message', () => {
  throw new Error(`Cannot find module '${__dirname}/no-such-module' imported from ${__filename}`);
});

// Worker-thread entry for one custom-operator run from the API: teach this thread TypeScript
// (tsx), then load the handler (so the API's event loop stays free while the circuit is optimised).
require('tsx/cjs/api').register();
require('./operator-thread.ts');

/** `npx tsx server/scripts/build-wasm.ts`: assemble server/wasm/sim-kernels.wasm when stale (npm test / npm start run it). */
import { buildSimKernelsIfStale, SIM_WASM_PATH } from '../lib/sim-wasm';

buildSimKernelsIfStale().then(
  (built) => { if (built) console.log(`built ${SIM_WASM_PATH}`); },
  (err) => { console.error(`could not assemble the simulator kernels (the JS kernels will run): ${err}`); process.exitCode = 1; },
);

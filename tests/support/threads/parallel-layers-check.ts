/**
 * Run under tsx (as the CLI and the worker process load code): one QAOA layer on 13 qubits with
 * two threads and with one, printing how many amplitudes differ. parallel-layers.ts ships its
 * kernels' source text to its threads, so it must survive tsx's compilation as well as jest's.
 */
import { createZeroState } from '../../../shared/engine/statevector/state';
import { applyQaoaLayer, applyTransverseMixer } from '../../../shared/engine/statevector/gates';
import { createParallelLayers } from '../../../shared/engine/statevector/parallel-layers';

const n = 13;
const blocking = { lowBits: 12, runBits: 8, tileBits: 14 };
const a = createZeroState(n, { shared: true });
const b = createZeroState(n, { shared: true });
for (let i = 0; i < a.amps.length; i++) a.amps[i] = b.amps[i] = Math.sin(i + 1);
const diag = Float64Array.from({ length: 1 << n }, (_, x) => ((x * 31) % 11) - 5);
const runner = createParallelLayers({ threads: 2 });
runner.applyQaoaLayer(a, diag, 0.3, 0.7, blocking);
runner.applyTransverseMixer(a, -1.1, blocking);
applyQaoaLayer(b, diag, 0.3, 0.7, blocking);
applyTransverseMixer(b, -1.1, blocking);
let differ = 0;
for (let i = 0; i < a.amps.length; i++) if (a.amps[i] !== b.amps[i]) differ++;
console.log(JSON.stringify({ differ, values: a.amps.length })); // re and im of 2^n amplitudes
void runner.close();

import { loadRunsConfig as load } from '../../../server/services/queue-config';

const loadRunsConfig = (env: Record<string, string>) => load(env as NodeJS.ProcessEnv);

describe('solve-service configuration', () => {
  test('the periodic queue reconciler runs at most 30 s apart (lost entries come back within 30 s)', () => {
    expect(loadRunsConfig({}).RUN_RECONCILE_MS).toBeLessThanOrEqual(30_000);
    expect(loadRunsConfig({ RUN_RECONCILE_MS: '30000' }).RUN_RECONCILE_MS).toBe(30_000);
    expect(() => loadRunsConfig({ RUN_RECONCILE_MS: '30001' })).toThrow(/RUN_RECONCILE_MS/);
    expect(() => loadRunsConfig({ RUN_RECONCILE_MS: '0' })).toThrow(/RUN_RECONCILE_MS/);
  });

  test('statevector layers use two threads unless told otherwise (1 = the solve thread alone, at most 7)', () => {
    expect(loadRunsConfig({}).SIM_THREADS).toBe(2);
    expect(loadRunsConfig({ SIM_THREADS: '1' }).SIM_THREADS).toBe(1);
    expect(() => loadRunsConfig({ SIM_THREADS: '0' })).toThrow(/SIM_THREADS/);
    expect(() => loadRunsConfig({ SIM_THREADS: '8' })).toThrow(/SIM_THREADS/);
  });
});

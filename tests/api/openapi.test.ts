import request from 'supertest';
import { applyTestEnv } from '../support/env';
import { loadConfig } from '../../server/config';
import { createDeps, closeDeps, type Deps } from '../../server/deps';
import { createApp } from '../../server/app';
import { apiRoutes } from '../../server/routes';

applyTestEnv();

describe('GET /api/openapi.json', () => {
  let deps: Deps;
  let dispose: () => void;
  afterAll(async () => {
    dispose?.();
    await closeDeps(deps);
  });

  test('is an OpenAPI 3.1 document listing every route of the route table with its method', async () => {
    deps = createDeps(loadConfig());
    const created = createApp(deps);
    dispose = created.dispose;
    const res = await request(created.app).get('/api/openapi.json');
    expect(res.status).toBe(200);
    expect(res.body.openapi).toBe('3.1.0');
    const routes = apiRoutes(deps);
    expect(routes.length).toBeGreaterThan(2);
    for (const r of routes) {
      const path = `/api${r.path}`.replace(/:([A-Za-z_]+)/g, '{$1}');
      expect(res.body.paths[path]?.[r.method]).toBeDefined();
      if (r.body) expect(res.body.paths[path][r.method].requestBody.content['application/json'].schema).toBeDefined();
    }
    // The run preview documents each solver's circuit resources per layout (docs/runs.md).
    const preview = res.body.paths['/api/runs/preview'].post.responses['200'].content['application/json'].schema;
    const circuit = preview.properties.solvers.items.properties.circuit;
    expect(JSON.stringify(circuit)).toMatch(/"twoQubitDepth"/);
    expect(Object.keys(circuit.anyOf.find((s: { type?: string }) => s.type === 'object').properties.layouts.properties)).toEqual(['all', 'line', 'grid']);
  });
});

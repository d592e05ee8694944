import { act, fireEvent, render, screen, waitFor } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { buildOpenApi } from '../../server/routes/openapi';
import { CreateRunBodySchema, RunIdParamsSchema } from '../../shared/schemas/runs';
import { NoBodySchema, type RouteSpec } from '../../server/lib/routes';
import { ApiDocsScreen } from '../../components/api-docs/ApiDocsScreen';

jest.mock('expo-router', () => ({ useRouter: () => ({ push: jest.fn() }) }));

/**
 * The API page renders the server's real OpenAPI builder output (server/routes/openapi.ts) for a
 * few routes with the real zod schemas: groups, methods, paths, the roles of the permission table
 * (shared/permissions.ts: runs:start is owner, admin, analyst, dispatcher), body fields, filter.
 */
const noop = () => undefined;
const routes: RouteSpec[] = [
  { method: 'post', path: '/runs', summary: 'Start a run', access: { kind: 'member', permission: 'runs:start' }, body: CreateRunBodySchema, handler: noop },
  { method: 'post', path: '/runs/:id/cancel', summary: 'Cancel a run', access: { kind: 'member', permission: 'runs:cancel' }, params: RunIdParamsSchema, body: NoBodySchema, handler: noop },
  { method: 'get', path: '/health', summary: 'Liveness', access: { kind: 'public' }, handler: noop },
];

beforeEach(() => {
  const doc = buildOpenApi(routes, 'http://127.0.0.1:3000');
  global.fetch = jest.fn(async () => ({ status: 200, ok: true, headers: { get: () => 'application/json' }, json: async () => doc, clone: () => ({ json: async () => doc }) })) as unknown as typeof fetch;
});

function renderPage() {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  return render(
    <QueryClientProvider client={client}>
      <ApiDocsScreen />
    </QueryClientProvider>,
  );
}

test('routes grouped by tag with method, path, who may call them and body fields', async () => {
  renderPage();
  await waitFor(() => expect(screen.getByTestId('api-group-runs')).toBeTruthy());
  expect(screen.getByTestId('api-group-health')).toBeTruthy();
  const start = screen.getByTestId('api-op-POST-/api/runs');
  expect(start.textContent).toContain('Start a run');
  expect(start.textContent).toContain('owner, admin, analyst, dispatcher');
  expect(start.textContent).not.toContain('viewer');
  expect(start.textContent).toContain('problem.kind');
  expect(start.textContent).toContain('one of: maxcut, bisection, kway');
  expect(screen.getByTestId('api-op-POST-/api/runs/{id}/cancel').textContent).toContain('in the path');
  expect(screen.getByTestId('api-op-GET-/api/health').textContent).toContain('anyone');
  expect(screen.getByTestId('api-authenticate').textContent).toContain('Authorization: Bearer');
});

test('the filter keeps the routes whose text has every word', async () => {
  renderPage();
  await waitFor(() => expect(screen.getByTestId('api-filter')).toBeTruthy());
  act(() => {
    fireEvent.change(screen.getByTestId('api-filter'), { target: { value: 'runs cancel' } });
  });
  await waitFor(() => expect(screen.queryByTestId('api-op-POST-/api/runs')).toBeNull());
  expect(screen.getByTestId('api-op-POST-/api/runs/{id}/cancel')).toBeTruthy();
  expect(screen.queryByTestId('api-group-health')).toBeNull();
  act(() => {
    fireEvent.change(screen.getByTestId('api-filter'), { target: { value: 'nothing-like-this' } });
  });
  await waitFor(() => expect(screen.getByText(/No route matches/)).toBeTruthy());
});

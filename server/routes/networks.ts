import { z } from 'zod';
import type { Deps } from '../deps';
import { NoBodySchema, type AuthContext, type RouteSpec } from '../lib/routes';
import { unauthorized } from '../lib/http-error';
import {
  CompareQuerySchema, IdParamsSchema, ImportFieldsSchema, NetworkBodySchema, NetworkListQuerySchema, RenameBodySchema, VersionBodySchema, VersionParamsSchema,
} from '../../shared/schemas/networks';
import {
  addVersion, compareVersions, createNetwork, deleteNetwork, duplicateVersion, getNetwork, getVersion, listNetworks, listVersions, renameNetwork, type Actor,
} from '../services/networks';
import { exportVersion, type ExportKind } from '../services/networks-export';
import { importNetwork, importUpload, prepareImport, previewOf, type ImportFiles } from '../services/imports';
import { DEMO_NETWORKS, copyDemoNetwork } from '../services/demo-networks';
import { MAX_FILE_BYTES, MAX_DEPOTS, MAX_LANES } from '../../shared/formats';

const read = { kind: 'member', permission: 'networks:read' } as const;
const write = { kind: 'member', permission: 'networks:write' } as const;

/** checkAccess has already required a member with an organisation; this narrows the type. */
function actorOf(auth: AuthContext | null): Actor {
  if (!auth || auth.organisationId === null) throw unauthorized();
  return { organisationId: auth.organisationId, userId: auth.userId };
}

const DemoBodySchema = z.object({ key: z.enum(DEMO_NETWORKS.map((d) => d.key) as [string, ...string[]], { error: `choose one of ${DEMO_NETWORKS.map((d) => d.key).join(', ')}` }) });

/** Networks, their immutable versions, import, export and the demo copies (docs/networks.md). */
export function networksRoutes(deps: Deps): RouteSpec[] {
  const exportRoute = (suffix: string, kind: (q: { part?: string }) => ExportKind): RouteSpec => ({
    method: 'get',
    path: `/networks/:id/versions/:versionId/export.${suffix}`,
    summary: `Download one version as ${suffix === 'csv' ? 'CSV (lanes; ?part=depots for the depots file)' : 'GeoJSON'}`,
    access: read,
    params: VersionParamsSchema,
    query: z.object({ part: z.enum(['lanes', 'depots']).optional() }),
    handler: async ({ params, query, auth, res }) => {
      const file = await exportVersion(deps, actorOf(auth).organisationId, params.id, params.versionId, kind(query));
      res.status(200).type(file.contentType).setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`);
      res.send(file.body);
      return undefined;
    },
  });

  return [
    {
      method: 'get', path: '/networks', summary: 'Networks of the organisation with their latest version summary', access: read, query: NetworkListQuerySchema,
      handler: ({ query, auth }) => listNetworks(deps, actorOf(auth).organisationId, query),
    },
    {
      method: 'post', path: '/networks', summary: 'Create a network (version 1)', access: write, body: NetworkBodySchema, status: 201,
      handler: async ({ body, auth }) => {
        const r = await createNetwork(deps, actorOf(auth), body, { source: 'api' });
        return { id: r.id, versionId: r.versionId, number: r.number };
      },
    },
    {
      method: 'get', path: '/networks/limits', summary: 'Import size limits (shown before upload)', access: read,
      handler: () => ({ maxFileBytes: MAX_FILE_BYTES, maxDepots: MAX_DEPOTS, maxLanes: MAX_LANES }),
    },
    {
      method: 'get', path: '/networks/demos', summary: 'Demo networks that can be copied into the organisation', access: read,
      handler: () => DEMO_NETWORKS.map((d) => ({ key: d.key, name: d.name, description: d.description, depots: d.document.depots.length, lanes: d.document.lanes.length })),
    },
    {
      method: 'post', path: '/networks/demos', summary: 'Copy a demo network into the organisation', access: write, body: DemoBodySchema, status: 201,
      handler: async ({ body, auth }) => {
        const r = await copyDemoNetwork(deps, actorOf(auth), body.key);
        return { id: r.id, versionId: r.versionId, number: r.number };
      },
    },
    {
      method: 'post', path: '/networks/import/preview', summary: 'Read an uploaded network file and report what would be imported (writes nothing)', access: write,
      before: [importUpload()], body: ImportFieldsSchema,
      handler: ({ body, req }) => previewOf(prepareImport((req.files ?? {}) as ImportFiles, body)),
    },
    {
      method: 'post', path: '/networks/import', summary: 'Import an uploaded network file as a new network (or a new version with networkId)', access: write,
      before: [importUpload()], body: ImportFieldsSchema, status: 201,
      handler: ({ body, req, auth }) => importNetwork(deps, actorOf(auth), (req.files ?? {}) as ImportFiles, body),
    },
    {
      method: 'get', path: '/networks/:id', summary: 'A network with its latest version (full document and summary)', access: read, params: IdParamsSchema,
      handler: ({ params, auth }) => getNetwork(deps, actorOf(auth).organisationId, params.id),
    },
    {
      method: 'patch', path: '/networks/:id', summary: 'Rename a network', access: write, params: IdParamsSchema, body: RenameBodySchema,
      handler: ({ params, body, auth }) => renameNetwork(deps, actorOf(auth).organisationId, params.id, body.name),
    },
    {
      method: 'delete', path: '/networks/:id', summary: 'Delete a network (its versions stay for the runs that use them)', access: write, params: IdParamsSchema,
      handler: async ({ params, auth }) => {
        await deleteNetwork(deps, actorOf(auth).organisationId, params.id);
        return undefined;
      },
    },
    {
      method: 'get', path: '/networks/:id/versions', summary: 'Versions of a network, newest first (without documents)', access: read, params: IdParamsSchema,
      handler: ({ params, auth }) => listVersions(deps, actorOf(auth).organisationId, params.id),
    },
    {
      method: 'post', path: '/networks/:id/versions', summary: 'Save a new version of a network', access: write, params: IdParamsSchema, body: VersionBodySchema, status: 201,
      handler: async ({ params, body, auth }) => {
        const r = await addVersion(deps, actorOf(auth), params.id, body, { source: 'drawn' });
        return { versionId: r.versionId, number: r.number };
      },
    },
    {
      method: 'get', path: '/networks/:id/versions/:versionId', summary: 'One version with its document', access: read, params: VersionParamsSchema,
      handler: ({ params, auth }) => getVersion(deps, actorOf(auth).organisationId, params.id, params.versionId),
    },
    {
      method: 'post', path: '/networks/:id/versions/:versionId/duplicate', summary: 'Save a copy of a version as the newest version', access: write, params: VersionParamsSchema, body: NoBodySchema, status: 201,
      handler: async ({ params, auth }) => {
        const r = await duplicateVersion(deps, actorOf(auth), params.id, params.versionId);
        return { versionId: r.versionId, number: r.number };
      },
    },
    exportRoute('csv', (q) => (q.part === 'depots' ? 'depots-csv' : 'lanes-csv')),
    exportRoute('geojson', () => 'geojson'),
    {
      method: 'get', path: '/networks/:id/compare', summary: 'Differences between two versions (depots, lanes, weight changes)', access: read, params: IdParamsSchema, query: CompareQuerySchema,
      handler: ({ params, query, auth }) => compareVersions(deps, actorOf(auth).organisationId, params.id, query.from, query.to),
    },
  ];
}

import { Op, type Order, type WhereOptions } from 'sequelize';
import type { Deps } from '../deps';
import { badRequest, notFound } from '../lib/http-error';
import { checkNetwork } from '../../shared/engine/network/build';
import type { NetworkDocument } from '../../shared/engine/network/types';
import { summariseNetwork } from '../../shared/networks/summary';
import { compareNetworks } from '../../shared/networks/compare';
import type {
  NetworkDetail, NetworkListItem, NetworkListQuery, NetworkSummary, VersionComparison, VersionDetail, VersionInfo, VersionSource,
} from '../../shared/schemas/networks';
import { VERSION_NOTE_MAX } from '../../shared/schemas/networks';
import type { NetworkRow } from '../models/network';
import { assertStorable } from './db-limits';
import type { NetworkVersionRow } from '../models/network-version';

/** Who is acting: the organisation every query is scoped to, and the user for created_by. */
export interface Actor {
  organisationId: number;
  userId: number | null;
}

export interface SaveOptions {
  source: VersionSource;
  note?: string | null;
  /**
   * Max-cut benchmark files (edge list, Spinyard JSON) carry signed ±1 weights; everything else
   * is a freight network whose volumes must be ≥ 0 (the formats module's convention).
   */
  allowSignedWeights?: boolean;
}

/** The document as stored: only known fields, in a fixed key order (stable JSON, clean diffs). */
export function canonicalDocument(name: string, doc: Pick<NetworkDocument, 'depots' | 'lanes'>): NetworkDocument {
  return {
    name,
    depots: doc.depots.map((d) => {
      const out: NetworkDocument['depots'][number] = { id: d.id };
      if (d.name !== undefined && d.name !== '') out.name = d.name;
      if (d.lat !== undefined) out.lat = d.lat;
      if (d.lon !== undefined) out.lon = d.lon;
      if (d.weight !== undefined) out.weight = d.weight;
      return out;
    }),
    lanes: doc.lanes.map((l) => ({ from: l.from, to: l.to, weight: l.weight })),
  };
}

/** The field a checkNetwork message is about, so the app can put it beside the right cell. */
function fieldOf(where: 'depots' | 'lanes', message: string): string {
  if (where === 'lanes') {
    if (message.startsWith('lane starts at')) return 'from';
    if (message.startsWith('lane ends at') || message.includes('to itself')) return 'to';
    return 'weight';
  }
  if (/latitude| lat /.test(message)) return 'lat';
  if (/longitude| lon /.test(message)) return 'lon';
  if (message.includes('weight')) return 'weight';
  return 'id';
}

/**
 * The network rules of shared/engine/network/build.ts (unique ids, known depots, no self-loops,
 * finite numbers) plus the volume rule; throws 400 with fields such as `lanes.7.weight`
 * (0-based like the JSON arrays) and a message naming the 1-based rows.
 */
export function assertValidDocument(doc: NetworkDocument, opts: { allowSignedWeights?: boolean } = {}): void {
  const issues = checkNetwork(doc);
  if (!opts.allowSignedWeights) {
    doc.lanes.forEach((l, i) => {
      if (typeof l.weight === 'number' && l.weight < 0) {
        issues.push({ where: 'lanes', row: i + 1, message: `lane ${l.from}–${l.to} has volume ${l.weight}; freight volumes must be ≥ 0 (signed weights are only for max-cut benchmark files: import those as an edge list or Spinyard JSON)` });
      }
    });
  }
  if (issues.length === 0) return;
  const fields: Record<string, string[]> = {};
  for (const i of issues) (fields[`${i.where}.${i.row - 1}.${fieldOf(i.where, i.message)}`] ??= []).push(i.message);
  const shown = issues.slice(0, 5).map((i) => `${i.where === 'lanes' ? 'lane' : 'depot'} row ${i.row}: ${i.message}`);
  const more = issues.length > 5 ? ` (and ${issues.length - 5} more)` : '';
  throw badRequest(`The network has ${issues.length} problem${issues.length === 1 ? '' : 's'}: ${shown.join('; ')}${more}.`, fields);
}

const iso = (d: Date | string) => new Date(d).toISOString();

function summaryOfRow(v: NetworkVersionRow): NetworkSummary {
  return {
    depots: v.depotCount, lanes: v.laneCount, totalVolume: v.totalVolume, components: v.componentCount,
    minDegree: v.minDegree, maxDegree: v.maxDegree, hasCoordinates: !!v.hasCoordinates,
  };
}

function versionInfo(v: NetworkVersionRow): VersionInfo {
  return { id: v.id, number: v.number, source: v.source, note: v.note ?? null, summary: summaryOfRow(v), createdAt: iso(v.createdAt), createdBy: v.createdBy ?? null };
}

function versionDetail(v: NetworkVersionRow): VersionDetail {
  return { ...versionInfo(v), networkId: v.networkId, document: JSON.parse(v.document) as NetworkDocument };
}

function listItem(n: NetworkRow): NetworkListItem {
  return {
    id: n.id, name: n.name, latestVersion: n.latestNumber, latestVersionId: n.latestVersionId ?? 0,
    summary: { depots: n.depotCount, lanes: n.laneCount, totalVolume: n.totalVolume },
    createdAt: iso(n.createdAt), updatedAt: iso(n.updatedAt),
  };
}

const live = (organisationId: number, id?: number): WhereOptions<NetworkRow> => ({ organisationId, deletedAt: null, ...(id !== undefined ? { id } : {}) });

/**
 * Notes are descriptions ("imported <file name>"), so a long one is shortened to the column's
 * size rather than refused (a 299-character upload name used to end the import in a 500).
 * Counted in code points, so a pair of UTF-16 surrogates is never split.
 */
function clipNote(note: string | null | undefined): string | null {
  if (!note) return null;
  const points = Array.from(note);
  return points.length <= VERSION_NOTE_MAX ? note : `${points.slice(0, VERSION_NOTE_MAX - 1).join('')}…`;
}

/** Writes the next version of a network inside the caller's transaction (row lock → numbering). */
async function writeVersion(deps: Deps, actor: Actor, network: NetworkRow, doc: NetworkDocument, opts: SaveOptions, transaction: import('sequelize').Transaction) {
  const { Network, NetworkVersion } = deps.models;
  const s = summariseNetwork(doc);
  const number = network.latestNumber + 1;
  const json = JSON.stringify(doc);
  await assertStorable(deps.db, json, `This network (${s.depots} depots, ${s.lanes} lanes)`);
  const version = await NetworkVersion.create(
    {
      networkId: network.id, organisationId: actor.organisationId, number, document: json,
      depotCount: s.depots, laneCount: s.lanes, totalVolume: s.totalVolume, componentCount: s.components,
      minDegree: s.minDegree, maxDegree: s.maxDegree, hasCoordinates: s.hasCoordinates,
      source: opts.source, note: clipNote(opts.note), createdBy: actor.userId,
    },
    { transaction },
  );
  const versionId = version.get('id') as number;
  await Network.update(
    { latestVersionId: versionId, latestNumber: number, depotCount: s.depots, laneCount: s.lanes, totalVolume: s.totalVolume, name: doc.name ?? network.name, updatedAt: new Date() },
    { where: { id: network.id }, transaction },
  );
  return { versionId, number };
}

/** New network with version 1. */
export async function createNetwork(
  deps: Deps, actor: Actor, body: { name: string; depots: NetworkDocument['depots']; lanes: NetworkDocument['lanes']; note?: string }, opts: SaveOptions & { demoKey?: string },
): Promise<{ id: number; versionId: number; number: number }> {
  const doc = canonicalDocument(body.name, body);
  assertValidDocument(doc, opts);
  return deps.db.transaction(async (transaction) => {
    const created = await deps.models.Network.create(
      { organisationId: actor.organisationId, name: body.name, latestNumber: 0, demoKey: opts.demoKey ?? null, createdBy: actor.userId },
      { transaction },
    );
    const network = created.get({ plain: true }) as NetworkRow;
    const v = await writeVersion(deps, actor, network, doc, { ...opts, note: opts.note ?? body.note ?? null }, transaction);
    return { id: network.id, ...v };
  });
}

/** New version of an existing network (numbers 1, 2, 3 … per network, never reused). */
export async function addVersion(
  deps: Deps, actor: Actor, networkId: number, body: { name?: string; depots: NetworkDocument['depots']; lanes: NetworkDocument['lanes']; note?: string }, opts: SaveOptions,
): Promise<{ versionId: number; number: number }> {
  return deps.db.transaction(async (transaction) => {
    const found = await deps.models.Network.findOne({ where: live(actor.organisationId, networkId), lock: transaction.LOCK.UPDATE, transaction });
    if (!found) throw notFound('Network');
    const network = found.get({ plain: true }) as NetworkRow;
    const doc = canonicalDocument(body.name ?? network.name, body);
    assertValidDocument(doc, opts);
    return writeVersion(deps, actor, network, doc, { ...opts, note: opts.note ?? body.note ?? null }, transaction);
  });
}

export async function listNetworks(deps: Deps, organisationId: number, query: NetworkListQuery): Promise<NetworkListItem[]> {
  const where: WhereOptions<NetworkRow> = { ...live(organisationId) };
  if (query.search) {
    const escaped = query.search.replace(/[\\%_]/g, (c) => `\\${c}`);
    Object.assign(where, { name: { [Op.like]: `%${escaped}%` } });
  }
  const order = query.order ?? (query.sort === 'name' ? 'asc' : 'desc');
  const dir = order.toUpperCase() as 'ASC' | 'DESC';
  const by: Order =
    query.sort === 'name' ? [['name', dir], ['id', dir]]
      : query.sort === 'size' ? [['depotCount', dir], ['laneCount', dir], ['id', dir]]
        : [['updatedAt', dir], ['id', dir]];
  const rows = await deps.models.Network.findAll({ where, order: by, limit: 500 });
  return rows.map((r) => listItem(r.get({ plain: true }) as NetworkRow));
}

async function findNetwork(deps: Deps, organisationId: number, id: number): Promise<NetworkRow> {
  const row = await deps.models.Network.findOne({ where: live(organisationId, id) });
  if (!row) throw notFound('Network');
  return row.get({ plain: true }) as NetworkRow;
}

async function findVersion(deps: Deps, organisationId: number, networkId: number, versionId: number): Promise<NetworkVersionRow> {
  const row = await deps.models.NetworkVersion.findOne({ where: { id: versionId, networkId, organisationId } });
  if (!row) throw notFound('Version');
  return row.get({ plain: true }) as NetworkVersionRow;
}

export async function getNetwork(deps: Deps, organisationId: number, id: number): Promise<NetworkDetail> {
  const n = await findNetwork(deps, organisationId, id);
  const latest = await findVersion(deps, organisationId, id, n.latestVersionId ?? 0);
  return { id: n.id, name: n.name, createdAt: iso(n.createdAt), updatedAt: iso(n.updatedAt), versionCount: n.latestNumber, latest: versionDetail(latest) };
}

export async function listVersions(deps: Deps, organisationId: number, id: number): Promise<VersionInfo[]> {
  await findNetwork(deps, organisationId, id);
  const rows = await deps.models.NetworkVersion.findAll({
    where: { networkId: id, organisationId },
    attributes: { exclude: ['document'] }, // lists never need the (possibly large) document
    order: [['number', 'DESC']],
  });
  return rows.map((r) => versionInfo(r.get({ plain: true }) as NetworkVersionRow));
}

export async function getVersion(deps: Deps, organisationId: number, id: number, versionId: number): Promise<VersionDetail> {
  await findNetwork(deps, organisationId, id);
  return versionDetail(await findVersion(deps, organisationId, id, versionId));
}

/**
 * The document of one version, for the solve service. Works for networks deleted after a run
 * was started (their versions stay, since runs refer to them).
 */
export async function getVersionDocument(deps: Deps, organisationId: number, versionId: number): Promise<NetworkDocument> {
  const row = await deps.models.NetworkVersion.findOne({ where: { id: versionId, organisationId } });
  if (!row) throw notFound('Network version');
  return JSON.parse(row.get('document') as string) as NetworkDocument;
}

/** Save an older (or the current) version again as the newest one. */
export async function duplicateVersion(deps: Deps, actor: Actor, id: number, versionId: number) {
  const v = await getVersion(deps, actor.organisationId, id, versionId);
  return addVersion(deps, actor, id, v.document, { source: 'duplicate', note: `copy of version ${v.number}`, allowSignedWeights: true });
}

export async function compareVersions(deps: Deps, organisationId: number, id: number, fromId: number, toId: number): Promise<VersionComparison> {
  await findNetwork(deps, organisationId, id);
  const [a, b] = await Promise.all([findVersion(deps, organisationId, id, fromId), findVersion(deps, organisationId, id, toId)]);
  const diff = compareNetworks(JSON.parse(a.document), JSON.parse(b.document));
  return { from: { id: a.id, number: a.number }, to: { id: b.id, number: b.number }, ...diff };
}

export async function renameNetwork(deps: Deps, organisationId: number, id: number, name: string) {
  await findNetwork(deps, organisationId, id);
  await deps.models.Network.update({ name }, { where: live(organisationId, id) });
  return { id, name };
}

/** Hides the network; its versions stay so runs that refer to them keep working. */
export async function deleteNetwork(deps: Deps, organisationId: number, id: number): Promise<void> {
  await findNetwork(deps, organisationId, id);
  await deps.models.Network.update({ deletedAt: new Date() }, { where: live(organisationId, id) });
}

export async function countNetworks(deps: Deps, organisationId: number): Promise<number> {
  return deps.models.Network.count({ where: live(organisationId) });
}

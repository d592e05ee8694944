import type { Request, Response, NextFunction, Router } from 'express';
import { z, type ZodType } from 'zod';
import { can, type Permission, type Role } from '../../shared/permissions';
import { HttpError, badRequest, forbidden, unauthorized } from './http-error';

/**
 * The route table: every API route is declared as data (method, path, who may call it, the zod
 * schemas for its input) so that guards, validation, error mapping, the OpenAPI document and the
 * tenant-isolation test all read the same source.
 */
export type Access =
  | { kind: 'public' } // anyone
  | { kind: 'user' } // any signed-in user
  | { kind: 'member'; permission: Permission }; // a member of the current organisation with this permission

export interface AuthContext {
  userId: number;
  organisationId: number | null;
  role: Role | null;
  via: 'session' | 'token';
  tokenId?: number;
}

export interface RouteInput<B = any, Q = any, P = any> {
  body: B;
  query: Q;
  params: P;
  auth: AuthContext | null;
  req: Request;
  res: Response;
}

export interface RouteSpec {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
  summary: string;
  access: Access;
  body?: ZodType;
  query?: ZodType;
  params?: ZodType;
  /** Shape of the successful JSON answer, for the OpenAPI document (not enforced). */
  response?: ZodType;
  /** Media type of a successful answer that is not JSON (a file download), for the OpenAPI document. */
  produces?: string;
  /** Status for a successful JSON answer (default 200). */
  status?: number;
  /** The handler returns the JSON body, or undefined when it wrote the response itself. */
  handler: (input: RouteInput) => Promise<unknown> | unknown;
  /** Extra middleware before validation (e.g. rate limits, file uploads). */
  before?: Array<(req: Request, res: Response, next: NextFunction) => void>;
}

/**
 * The body of a state-changing route that takes no input: `{}` or nothing. Declared anyway so
 * every POST/PUT/PATCH validates its body and unexpected fields are refused with 400.
 */
export const NoBodySchema = z.object({}).strict();

declare module 'express-serve-static-core' {
  interface Request {
    auth?: AuthContext | null;
  }
}

function fieldErrors(error: { issues: { path: PropertyKey[]; message: string }[] }): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join('.') || '_';
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}

function parsePart(schema: ZodType | undefined, value: unknown, where: string) {
  if (!schema) return value;
  const parsed = schema.safeParse(value ?? {});
  if (!parsed.success) throw badRequest(`Some ${where} fields are not valid.`, fieldErrors(parsed.error));
  return parsed.data;
}

export function checkAccess(access: Access, auth: AuthContext | null | undefined): void {
  if (access.kind === 'public') return;
  if (!auth) throw unauthorized();
  if (access.kind === 'user') return;
  if (auth.organisationId === null || !auth.role) throw new HttpError(403, 'You are not a member of an organisation right now.', { code: 'no-organisation' });
  if (!can(auth.role, access.permission)) {
    throw forbidden(`Your role (${auth.role}) does not allow this (${access.permission}). Ask an admin of the organisation.`);
  }
}

export function mountRoutes(router: Router, specs: RouteSpec[]): void {
  for (const spec of specs) {
    router[spec.method](spec.path, ...(spec.before ?? []), async (req: Request, res: Response, next: NextFunction) => {
      try {
        checkAccess(spec.access, req.auth);
        const input: RouteInput = {
          params: parsePart(spec.params, req.params, 'path'),
          query: parsePart(spec.query, req.query, 'query'),
          body: parsePart(spec.body, req.body, 'body'),
          auth: req.auth ?? null,
          req,
          res,
        };
        const result = await spec.handler(input);
        if (result === undefined) {
          if (!res.headersSent) res.status(spec.status ?? 204).end();
          return;
        }
        res.status(spec.status ?? 200).json(result);
      } catch (err) {
        next(err);
      }
    });
  }
}

export function errorBody(err: unknown): { status: number; body: Record<string, unknown> } {
  if (err instanceof HttpError) return { status: err.status, body: { error: err.message, ...(err.details ?? {}) } };
  const e = err as { type?: string; status?: number; message?: string };
  if (e && e.type === 'entity.parse.failed') return { status: 400, body: { error: 'The request body is not valid JSON.' } };
  if (e && e.type === 'entity.too.large') {
    const limit = (e as { limit?: number }).limit;
    const accepts = limit ? `the ${Math.round(limit / (1024 * 1024))} MB this request accepts` : 'what this request accepts';
    return { status: 413, body: { error: `The request body is larger than ${accepts}.`, code: 'body_too_large' } };
  }
  return { status: 500, body: { error: 'Something went wrong on our side. Try again; if it persists, contact support.' } };
}

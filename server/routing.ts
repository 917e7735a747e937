import type { Request, Response, Router } from 'express';
import type { ZodType } from 'zod';
import { z } from 'zod';
import '../shared/schemas/messages.js';
import { defineAbilityFor, type Action, type Actor, type AppAbility, type SubjectName } from '../shared/abilities.js';
import { AppError, forbidden, unauthorized } from './errors.js';

/** Who may call a route: anyone, anyone signed in, or those whose ability allows [action, subject]. */
export type Access = 'public' | 'signed-in' | readonly [Action, SubjectName];

export interface RouteContext<B = any, Q = any, P = any> {
  req: Request;
  res: Response;
  actor: Actor | null;
  ability: AppAbility;
  body: B;
  query: Q;
  params: P;
}

export interface RouteDef {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  /** Path below /api, in Express syntax. */
  path: string;
  access: Access;
  body?: ZodType;
  query?: ZodType;
  params?: ZodType;
  /** Multipart uploads parse their own body (see the evidence feature). */
  before?: (req: Request, res: Response) => Promise<void>;
  handler: (ctx: RouteContext) => Promise<unknown>;
  status?: number;
  /** Answered before the session cookie is looked up (probes: they must not need the database). Public only. */
  noSession?: boolean;
}

/** A handler's answer with a status of its own (e.g. 503 from the health check); `def.status` is the usual one. */
export class WithStatus {
  constructor(readonly status: number, readonly body: unknown) {}
}
export const withStatus = (status: number, body: unknown) => new WithStatus(status, body);

/** Typed helper so handlers see the inferred body, query and params. */
export function route<B extends ZodType = ZodType<undefined>, Q extends ZodType = ZodType<undefined>, P extends ZodType = ZodType<undefined>>(
  def: Omit<RouteDef, 'handler' | 'body' | 'query' | 'params'> & {
    body?: B;
    query?: Q;
    params?: P;
    handler: (ctx: RouteContext<z.infer<B>, z.infer<Q>, z.infer<P>>) => Promise<unknown>;
  },
): RouteDef {
  return def as RouteDef;
}

function fieldsOf(error: z.ZodError, prefix: string): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = [prefix, ...issue.path.map(String)].filter(Boolean).join('.') || prefix;
    fields[key] ??= issue.message;
  }
  return fields;
}

function parse(schema: ZodType | undefined, value: unknown, where: 'body' | 'query' | 'params') {
  if (!schema) return value;
  const result = schema.safeParse(value ?? (where === 'body' ? {} : value));
  if (result.success) return result.data;
  const fields = fieldsOf(result.error, where === 'body' ? '' : where);
  const first = Object.entries(fields)[0];
  throw new AppError(400, 'invalid_input', first ? `${first[0]}: ${first[1]}` : 'Invalid input.', fields);
}

export function checkAccess(access: Access, actor: Actor | null, ability: AppAbility): void {
  if (access === 'public') return;
  if (!actor) throw unauthorized();
  if (access === 'signed-in') return;
  const [action, subject] = access;
  if (!ability.can(action, subject)) throw forbidden();
}

/** Builds the Express routes from the table: access → validation → handler, in that order. */
export function mountRoutes(router: Router, table: readonly RouteDef[]): void {
  for (const def of table) {
    router[def.method](def.path, async (req: Request, res: Response) => {
      const actor = (res.locals.actor ?? null) as Actor | null;
      const ability = (res.locals.ability ?? defineAbilityFor(null)) as AppAbility;
      checkAccess(def.access, actor, ability);
      if (def.before) await def.before(req, res);
      const ctx: RouteContext = {
        req,
        res,
        actor,
        ability,
        params: parse(def.params, req.params, 'params'),
        query: parse(def.query, req.query, 'query'),
        body: parse(def.body, req.body, 'body'),
      };
      const result = await def.handler(ctx);
      if (res.headersSent) return;
      if (result instanceof WithStatus) res.status(result.status).json(result.body);
      else if (result === undefined) res.status(def.status ?? 204).end();
      else res.status(def.status ?? 200).json(result);
    });
  }
}

import { Router, type Request, type RequestHandler, type Response } from 'express';
import type { z } from 'zod';
import { permissions, type Permission } from '@wickstone/contracts';
import { fieldError, fieldsError, parseRequest } from '../errors.js';
import { orgScope, requirePermission, requireSignedIn } from './access.js';
import type { Csrf } from './csrf.js';
import { requestMeta, type OrgScope, type RequestMeta, type SessionState } from './request-state.js';

/** Who may call a route: anyone, any signed-in user, or a member whose role has this permission. */
export type Access = 'public' | 'signedIn' | Permission;
export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

type Schema = z.ZodType;
type Out<S> = S extends z.ZodType ? z.output<S> : undefined;

/** One row of the route table: what later issues' tests (the permission matrix, bad input) read. */
export interface RouteRecord {
  method: Method;
  /** The full path as Express matches it, e.g. `/api/v1/orgs/:orgId/members/:userId`. */
  path: string;
  access: Access;
  /** True for every state-changing method unless the route is declared `csrfExempt`: such a route wants the CSRF token. */
  csrf: boolean;
  /** Why a state-changing route takes no CSRF token (a cookie-less public API). */
  csrfExempt?: string;
  params?: Schema;
  query?: Schema;
  body?: Schema;
}

export interface RouteSpec<A extends Access, P, Q, B> {
  access: A;
  params?: P;
  query?: Q;
  body?: B;
  /** Extra middleware run after access checks and validation, before the handler (rate limits). */
  use?: RequestHandler[];
  /**
   * For a public API called from other sites without cookies (the embed API): say why, and the
   * route takes no CSRF token and never sees the caller's session, so a cross-site request cannot
   * act as the person whose browser sent it.
   */
  csrfExempt?: A extends 'public' ? string : never;
}

export interface RouteContext<A extends Access, P, Q, B> {
  req: Request;
  res: Response;
  params: Out<P>;
  query: Out<Q>;
  body: Out<B>;
  session: A extends 'public' ? SessionState | null : SessionState;
  org: A extends Permission ? OrgScope : null;
  meta: RequestMeta;
}

/** A handler's answer: JSON `body` with `status` (200 by default), or no content (204) when it returns nothing. */
export interface Reply {
  status?: number;
  body?: unknown;
}

type Handler<A extends Access, P, Q, B> = (
  ctx: RouteContext<A, P, Q, B>,
) => Promise<Reply | void> | Reply | void;

type BodyRoute = <
  A extends Access,
  P extends Schema | undefined = undefined,
  B extends Schema | undefined = undefined,
>(
  path: string,
  spec: RouteSpec<A, P, undefined, B>,
  handler: Handler<A, P, undefined, B>,
) => void;
type BodylessRoute = <A extends Access, P extends Schema | undefined = undefined>(
  path: string,
  spec: RouteSpec<A, P, undefined, undefined>,
  handler: Handler<A, P, undefined, undefined>,
) => void;

const SAFE_METHODS = new Set<Method>(['get']);
const ORG_PREFIX = /^\/orgs\/:orgId(\/|$)/;

/** A route with no declared query or body takes none: an unexpected key is named, like any extra field. */
function refuseUndeclared(data: unknown, where: 'query' | 'body'): void {
  if (data === undefined) return;
  if (typeof data !== 'object' || data === null || Array.isArray(data))
    throw fieldError(where, `No ${where} expected`);
  const keys = Object.keys(data);
  if (keys.length) throw fieldsError(keys.map((k) => ({ field: `${where}.${k}`, message: 'Unknown field' })));
}

/**
 * The API's routes, each declared with who may call it. Declaring a route here is the only way to add
 * one, so the access rules (CSRF for state changes, sign-in, organisation scope, permission) cannot be
 * forgotten, and `records` is the complete route × access table the matrix test is generated from.
 *
 * Order on every route: CSRF (state changes) → signed in → organisation membership (404) →
 * permission (403) → params, query, body (400) → `use` → handler.
 */
export class ApiRoutes {
  readonly router: Router = Router();
  readonly records: RouteRecord[] = [];

  constructor(
    private readonly base: string,
    private readonly csrf: Csrf,
  ) {}

  /** GET takes params and a query, never a body. */
  get<A extends Access, P extends Schema | undefined = undefined, Q extends Schema | undefined = undefined>(
    path: string,
    spec: RouteSpec<A, P, Q, undefined>,
    handler: Handler<A, P, Q, undefined>,
  ): void {
    this.add('get', path, spec, handler);
  }

  /** State changes take params and a body, never a query; DELETE takes no body either. */
  readonly post: BodyRoute = (path, spec, handler) => this.add('post', path, spec, handler);
  readonly put: BodyRoute = (path, spec, handler) => this.add('put', path, spec, handler);
  readonly patch: BodyRoute = (path, spec, handler) => this.add('patch', path, spec, handler);
  readonly delete: BodylessRoute = (path, spec, handler) => this.add('delete', path, spec, handler);

  private add<
    A extends Access,
    P extends Schema | undefined,
    Q extends Schema | undefined,
    B extends Schema | undefined,
  >(method: Method, path: string, spec: RouteSpec<A, P, Q, B>, handler: Handler<A, P, Q, B>) {
    const { access } = spec;
    const isPermission = access !== 'public' && access !== 'signedIn';
    if (isPermission && !(access in permissions)) throw new Error(`${path}: unknown permission ${access}`);
    if (isPermission !== ORG_PREFIX.test(path)) {
      throw new Error(
        `${method.toUpperCase()} ${path}: a permission is checked in an organisation, so /orgs/:orgId routes and only they take one`,
      );
    }
    if (/:[A-Za-z]/.test(path) && !spec.params)
      throw new Error(`${path}: a route with path parameters declares their schema`);
    const full = `${this.base}${path}`;
    if (this.records.some((r) => r.method === method && r.path === full))
      throw new Error(`${method} ${full} declared twice`);
    if (spec.csrfExempt !== undefined && access !== 'public')
      throw new Error(`${path}: only a public route may be CSRF-exempt`);
    const csrf = !SAFE_METHODS.has(method) && spec.csrfExempt === undefined;
    this.records.push({
      method,
      path: full,
      access,
      csrf,
      ...(spec.csrfExempt !== undefined ? { csrfExempt: spec.csrfExempt } : {}),
      ...(spec.params ? { params: spec.params } : {}),
      ...(spec.query ? { query: spec.query } : {}),
      ...(spec.body ? { body: spec.body } : {}),
    });

    const chain: RequestHandler[] = [];
    if (csrf) chain.push(this.csrf.require);
    if (access !== 'public') chain.push(requireSignedIn);
    if (isPermission) chain.push(orgScope, requirePermission(access));
    const validate: RequestHandler = (req, res, next) => {
      const ctx = {
        req,
        res,
        params: spec.params ? parseRequest(spec.params, req.params, 'params') : undefined,
        query: spec.query
          ? parseRequest(spec.query, req.query, 'query')
          : refuseUndeclared(req.query, 'query'),
        body: spec.body ? parseRequest(spec.body, req.body, 'body') : refuseUndeclared(req.body, 'body'),
        session: spec.csrfExempt === undefined ? (req.session ?? null) : null,
        org: req.org ?? null,
        meta: requestMeta(req),
      };
      res.locals.routeContext = ctx;
      next();
    };
    chain.push(validate, ...(spec.use ?? []));
    chain.push(async (_req, res) => {
      const ctx = res.locals.routeContext as RouteContext<A, P, Q, B>;
      const reply = await handler(ctx);
      if (!reply || reply.body === undefined) {
        res.status(reply?.status ?? 204).end();
        return;
      }
      res.status(reply.status ?? 200).json(reply.body);
    });
    this.router[method](path, ...chain);
  }
}

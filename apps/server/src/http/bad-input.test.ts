import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { z } from 'zod';
import type request from 'supertest';
import { routeTable } from '../app.js';
import { TestClient, createTestApp } from '../../testing/client.js';
import { seedOrgWithTeam, snapshotTables, type FixtureOrg } from '../../testing/fixtures.js';
import { probeUrl, routeKey } from '../../testing/routes.js';
import type { RouteRecord } from './routes.js';

/*
 * Bad input on every route, generated from the route table and each route's declared schemas:
 * missing, unknown, wrong-typed and oversized fields in body, query and path answer 400 naming the
 * field; an oversized body 413; malformed JSON 400. Never a 500, never a stack trace, and nothing
 * stored changes. The caller is an owner, who may call every route, so the answer is validation's.
 */
const t = await createTestApp();
const routes = routeTable(t.app);
const OVERSIZED = 'x'.repeat(20_000);
const WRONG_TYPES: unknown[] = [12345, true, { nested: 'object' }, ['list'], 'not-a-number'];

interface Fields {
  fields: Array<{ field: string; message: string }>;
}
function fieldsOf(res: request.Response): string[] {
  return ((res.body?.error?.details ?? { fields: [] }) as Fields).fields.map((f) => f.field);
}
function shapeOf(schema: z.ZodType | undefined): Record<string, z.ZodType> {
  const shape = (schema as unknown as { shape?: Record<string, z.ZodType> } | undefined)?.shape;
  return shape ?? {};
}
/** A value the field's schema refuses (and that is not just "missing"). */
function wrongValueFor(field: z.ZodType): unknown {
  const v = WRONG_TYPES.find((candidate) => !field.safeParse(candidate).success);
  if (v === undefined) throw new Error('no wrong-typed value found for a field');
  return v;
}
/**
 * The same for a query parameter, which always arrives as text: a candidate counts only if the
 * schema refuses its text. Free text (a search) has no wrong type, only a wrong size; undefined then.
 */
function wrongQueryValueFor(field: z.ZodType): string | undefined {
  return WRONG_TYPES.map(String).find((candidate) => !field.safeParse(candidate).success);
}

let org: FixtureOrg;
let owner: TestClient;
let before: Record<string, string>;
const seen: request.Response[] = [];

beforeAll(async () => {
  org = await seedOrgWithTeam();
  owner = new TestClient(t.app);
  await owner.login(org.users.owner.email, org.users.owner.password);
  // Sessions and the audit of sign-ins may change; nothing else may.
  before = await snapshotTables(t.db.sequelize, ['audit_events', 'session_revocations']);
});

async function call(
  route: RouteRecord,
  opts: { url?: string; body?: unknown; query?: string; raw?: string } = {},
): Promise<request.Response> {
  const url = (opts.url ?? probeUrl(route, { orgId: org.id }).replace(/^\/api\/v1/, '')) + (opts.query ?? '');
  let res: request.Response;
  if (opts.raw !== undefined) {
    const token = await owner.csrf();
    res = await owner.agent[route.method](`/api/v1${url}`)
      .set('x-csrf-token', token)
      .set('Content-Type', 'application/json')
      .send(opts.raw);
  } else {
    res = await owner.send(route.method, url, opts.body);
  }
  seen.push(res);
  return res;
}

function expect400(res: request.Response, field: string, what: string) {
  expect(res.status, `${what}: ${res.text.slice(0, 300)}`).toBe(400);
  expect(res.body.error.code, what).toMatch(/^(validation_failed|bad_request)$/);
  expect(fieldsOf(res), `${what}: ${res.text.slice(0, 300)}`).toContain(field);
}

const withBody = routes.filter((r) => r.body);
const bodyless = routes.filter((r) => !r.body && r.method !== 'get');
const withParams = routes.filter((r) => r.params);

describe.each(withBody.map((r) => [routeKey(r), r] as const))('%s body', (key, route) => {
  const shape = shapeOf(route.body);
  const required = Object.keys(shape).filter((k) => !shape[k]!.safeParse(undefined).success);

  it('names every missing required field', async () => {
    const res = await call(route, { body: {} });
    if (required.length === 0) {
      expect(res.status, key).toBeLessThan(500);
      return;
    }
    for (const k of required) expect400(res, `body.${k}`, `${key} without ${k}`);
  });

  it('names an unknown field', async () => {
    expect400(await call(route, { body: { unexpectedField: 'surprise' } }), 'body.unexpectedField', key);
  });

  it.each(Object.keys(shape))('names a wrong-typed %s', async (k) => {
    expect400(await call(route, { body: { [k]: wrongValueFor(shape[k]!) } }), `body.${k}`, `${key} ${k}`);
  });

  it.each(Object.keys(shape))('names an oversized %s', async (k) => {
    expect400(await call(route, { body: { [k]: OVERSIZED } }), `body.${k}`, `${key} ${k}`);
  });

  it('refuses a body that is not an object', async () => {
    expect400(await call(route, { body: ['a', 'list'] }), 'body', key);
  });
});

describe.each([...withBody, ...bodyless].map((r) => [routeKey(r), r] as const))(
  '%s transport',
  (key, route) => {
    it('answers an oversized body with 413', async () => {
      const res = await call(route, { raw: JSON.stringify({ blob: 'x'.repeat(70 * 1024) }) });
      expect(res.status, key).toBe(413);
      expect(res.body.error.code).toBe('payload_too_large');
    });

    it('answers malformed JSON with 400 naming the body', async () => {
      expect400(await call(route, { raw: '{"email": ' }), 'body', key);
    });
  },
);

describe.each(bodyless.map((r) => [routeKey(r), r] as const))('%s takes no body', (key, route) => {
  it('names a field it was not expecting', async () => {
    expect400(await call(route, { body: { unexpectedField: 1 } }), 'body.unexpectedField', key);
  });
});

describe.each(routes.map((r) => [routeKey(r), r] as const))('%s query', (key, route) => {
  const shape = shapeOf(route.query);
  it('names an unknown query parameter', async () => {
    expect400(await call(route, { query: '?unexpectedParam=1' }), 'query.unexpectedParam', key);
  });
  const typed = Object.keys(shape).filter((k) => wrongQueryValueFor(shape[k]!) !== undefined);
  it.each(typed)('names a wrong-typed %s', async (k) => {
    expect400(
      await call(route, { query: `?${k}=${encodeURIComponent(wrongQueryValueFor(shape[k]!)!)}` }),
      `query.${k}`,
      `${key} ${k}`,
    );
  });
  it.each(Object.keys(shape))('names an oversized %s', async (k) => {
    expect400(await call(route, { query: `?${k}=${'9'.repeat(5000)}` }), `query.${k}`, `${key} ${k}`);
  });
});

describe.each(withParams.map((r) => [routeKey(r), r] as const))('%s path', (key, route) => {
  const names = [...route.path.matchAll(/:([A-Za-z]+)/g)].map((m) => m[1]!);
  it.each(names)('names a wrong-typed or oversized :%s', async (name) => {
    for (const bad of name === 'token' ? ['short', 'y'.repeat(5000)] : ['abc', '-4', '1.5', '9'.repeat(40)]) {
      const url = probeUrl(route, { orgId: org.id, [name]: bad }).replace(/^\/api\/v1/, '');
      const body = route.method === 'get' || route.method === 'delete' ? undefined : {};
      expect400(await call(route, { url, body }), `params.${name}`, `${key} :${name}=${bad.slice(0, 12)}`);
    }
  });
});

describe('after all of it', () => {
  it('never answered 500, never showed a stack trace, and changed nothing stored', async () => {
    expect(seen.length).toBeGreaterThan(100);
    for (const res of seen) {
      expect(res.status).toBeLessThan(500);
      expect(res.text).not.toMatch(/\bat .+\.(ts|js):\d+/);
      expect(res.text).not.toMatch(/"stack"/);
      expect(res.headers['content-type'] ?? '').toMatch(res.status === 204 ? /.*/ : /application\/json/);
    }
    expect(await snapshotTables(t.db.sequelize, ['audit_events', 'session_revocations'])).toEqual(before);
  });
});

afterAll(async () => {
  await t.close();
});

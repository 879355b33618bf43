import { randomUUID } from 'node:crypto';
import request from 'supertest';
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import { calculate } from '@wickstone/calc-core';
import { errorBodySchema, widgetSchema, type WidgetSettings } from '@wickstone/contracts';
import type { TestClient } from './client.js';
import { inventRun, reportOf, type InventedRun, type RunWidget } from '../src/runs/invent.js';
import { storeRuns, type RunRow } from '../src/runs/store.js';

/*
 * Fixtures for the usage and lead tests: live widgets made through the API, runs at chosen times
 * stored through the same code as the embed API's, and reports and requests sent to the embed API
 * itself. Everything invented, on `.example` sites.
 */

export const SITE = 'https://www.brackenridge-ground.example';
export const PORTAL = 'https://portal.brackenridge-ground.example';

/** The fields a 400 names, in order. */
export const fieldsOf = (body: unknown): string[] =>
  (errorBodySchema.parse(body).error.details as { fields: { field: string }[] }).fields.map((f) => f.field);

export type FixtureWidget = RunWidget & { name: string; publicKey: string };

/** A live widget of `calculatorId`, allowed on `origins`, made by the organisation's owner. */
export async function liveWidget(
  owner: TestClient,
  orgId: number,
  name: string,
  calculatorId: string,
  origins: string[] = [SITE, PORTAL],
  edit: (s: WidgetSettings) => WidgetSettings = (s) => s,
): Promise<FixtureWidget> {
  const created = widgetSchema.parse(
    (await owner.post(`/orgs/${orgId}/widgets`, { name, calculatorId, allowedOrigins: origins }).expect(201))
      .body,
  );
  const w = widgetSchema.parse(
    (
      await owner
        .patch(`/orgs/${orgId}/widgets/${created.id}`, {
          status: 'live',
          settings: edit(structuredClone(created.settings)),
        })
        .expect(200)
    ).body,
  );
  return { ...w, organizationId: orgId };
}

/** An invented run of `w` at `at` (ISO time), with a fresh id. */
export function runAt(
  w: RunWidget,
  at: string,
  inputs: Record<string, number | string>,
  opts: Partial<InventedRun> = {},
): RunRow {
  return inventRun(w, inputs, { id: randomUUID(), origin: SITE, ...opts, createdAt: new Date(at) });
}

/** Store runs (and count them in the rollups) in one transaction, as the embed API does. */
export async function store(sequelize: Sequelize, rows: RunRow[]): Promise<void> {
  await sequelize.transaction((transaction) => storeRuns(sequelize, rows, transaction));
}

/** Report a run through the public embed API from `origin`; answers its id. */
export async function reportRun(
  app: Express,
  w: FixtureWidget,
  inputs: Record<string, number | string>,
  origin = SITE,
): Promise<string> {
  const r = calculate(w.calculatorId, inputs);
  const body = reportOf(r, {
    id: randomUUID(),
    publicKey: w.publicKey,
    unitSystem: w.settings.units.system,
    pageUrl: `${origin}/services/damp-survey`,
  });
  await request(app).post('/api/v1/embed/runs').set('Origin', origin).send(body).expect(201);
  return body.id;
}

/** Send a request for a site assessment from a run through the public embed API; answers the lead's id. */
export async function requestAssessment(
  app: Express,
  w: FixtureWidget,
  runId: string,
  fields: Record<string, string>,
  origin = SITE,
  /** Ask for a copy of the result by e-mail (to `fields.email`). */
  sendCopy = false,
): Promise<number> {
  const res = await request(app)
    .post('/api/v1/embed/leads')
    .set('Origin', origin)
    .send({ runId, publicKey: w.publicKey, fields, consent: true, ...(sendCopy ? { sendCopy } : {}) });
  if (res.status !== 201) throw new Error(`lead answered ${res.status}: ${res.text}`);
  return (res.body as { id: number }).id;
}

import { calculate } from '@wickstone/calc-core';
import { widgetSchema, type Widget, type WidgetSettings } from '@wickstone/contracts';
import { reportOf } from '../src/runs/invent.js';
import type { TestClient } from './client.js';

/**
 * A run report as the widget sends it: computed with calc-core from `inputs` (a tube-rise run by
 * default), for the widget with `publicKey`.
 */
export function runReportBody(
  publicKey: string,
  p: { id: string; calculatorId?: string; inputs?: Record<string, unknown>; pageUrl?: string },
) {
  const r = calculate(p.calculatorId ?? 'tube-rise', p.inputs ?? { diameter: 0.0008 });
  return reportOf(r, {
    id: p.id,
    publicKey,
    unitSystem: 'si',
    ...(p.pageUrl === undefined ? {} : { pageUrl: p.pageUrl }),
  });
}

/** A tube-rise widget made live by `owner` for `origins`, its settings first changed by `change`. */
export async function createLiveWidget(
  owner: TestClient,
  orgId: number,
  name: string,
  origins: string[],
  change: (settings: WidgetSettings) => void = () => undefined,
): Promise<Widget> {
  const created = widgetSchema.parse(
    (
      await owner
        .post(`/orgs/${orgId}/widgets`, { name, calculatorId: 'tube-rise', allowedOrigins: origins })
        .expect(201)
    ).body,
  );
  const settings = structuredClone(created.settings);
  change(settings);
  return widgetSchema.parse(
    (await owner.patch(`/orgs/${orgId}/widgets/${created.id}`, { status: 'live', settings }).expect(200))
      .body,
  );
}

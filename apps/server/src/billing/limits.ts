import type { Transaction } from 'sequelize';
import type { Plan } from '@wickstone/contracts';
import { Organization, Widget } from '../db/models/index.js';
import { AppError } from '../errors.js';
import { standingFor } from './plan.js';

const upgradePath = (orgId: number) => `/orgs/${orgId}/billing`;
const widgetWord = (n: number) => (n === 1 ? 'widget' : 'widgets');

/** Creating a widget: refused once the firm has as many as its plan allows, with the way to upgrade. */
export async function assertWidgetRoom(orgId: number, transaction: Transaction): Promise<void> {
  // Serialise limit checks per firm so two requests cannot both take the last place.
  await Organization.findByPk(orgId, { attributes: ['id'], lock: transaction.LOCK.UPDATE, transaction });
  const { plan } = await standingFor(orgId, transaction);
  const count = await Widget.count({ where: { organizationId: orgId }, transaction });
  if (count < plan.limits.widgets) return;
  throw new AppError(
    'plan_limit',
    `The ${plan.name} plan allows ${plan.limits.widgets} ${widgetWord(plan.limits.widgets)} and this firm has ${count}. ` +
      'An owner can move to a larger plan under Billing.',
    { plan: plan.id, limit: plan.limits.widgets, count, upgrade: upgradePath(orgId) },
  );
}

/** Putting a widget live: refused past the plan's live widgets, naming the ones that are live. */
export async function assertLiveRoom(
  orgId: number,
  widgetId: number,
  transaction: Transaction,
): Promise<void> {
  await Organization.findByPk(orgId, { attributes: ['id'], lock: transaction.LOCK.UPDATE, transaction });
  const { plan } = await standingFor(orgId, transaction);
  const live = (await liveWidgets(orgId, transaction)).filter((w) => w.id !== widgetId);
  if (live.length < plan.limits.liveWidgets) return;
  throw new AppError(
    'plan_limit',
    `The ${plan.name} plan allows ${plan.limits.liveWidgets} ${widgetWord(plan.limits.liveWidgets)} in service, and ` +
      `${live.map((w) => `"${w.name}"`).join(', ')} ${live.length === 1 ? 'is' : 'are'} in service. ` +
      'Put one on hold, or an owner can move to a larger plan under Billing.',
    { plan: plan.id, limit: plan.limits.liveWidgets, live, upgrade: upgradePath(orgId) },
  );
}

export async function liveWidgets(
  orgId: number,
  transaction?: Transaction,
): Promise<{ id: number; name: string }[]> {
  const rows = await Widget.findAll({
    where: { organizationId: orgId, status: 'live' },
    attributes: ['id', 'name'],
    order: [['id', 'ASC']],
    transaction,
  });
  return rows.map((w) => ({ id: w.id, name: w.name }));
}

/** Moving down to `target`: refused while more widgets are live than it allows, saying which. */
export async function assertFitsPlan(orgId: number, target: Plan): Promise<void> {
  const live = await liveWidgets(orgId);
  const excess = live.length - target.limits.liveWidgets;
  if (excess <= 0) return;
  throw new AppError(
    'conflict',
    `The ${target.name} plan allows ${target.limits.liveWidgets} ${widgetWord(target.limits.liveWidgets)} in service and ${live.length} are in service: ` +
      `put ${excess} of them on hold first (${live.map((w) => `"${w.name}"`).join(', ')}).`,
    { plan: target.id, limit: target.limits.liveWidgets, takeDown: excess, live },
  );
}

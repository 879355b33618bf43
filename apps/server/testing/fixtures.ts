import { randomBytes } from 'node:crypto';
import bcrypt from 'bcryptjs';
import { QueryTypes, type Sequelize } from 'sequelize';
import type { PlanId, Role } from '@wickstone/contracts';
import { roles } from '@wickstone/contracts';
import { BillingAccount, Membership, Organization, User } from '../src/db/models/index.js';
import { accountRow } from '../src/billing/plan.js';

/** An address no other test uses, on a reserved domain. */
export function uniqueEmail(tag = 'user'): string {
  return `${tag}-${Date.now().toString(36)}-${randomBytes(4).toString('hex')}@tests.example`;
}

export interface FixtureUser {
  id: number;
  email: string;
  name: string;
  password: string;
  role: Role;
}

export interface FixtureOrg {
  id: number;
  name: string;
  users: Record<Role, FixtureUser>;
}

/**
 * An organisation with one member per role, written straight to the database (bcrypt cost 4) so
 * tests about access start from a known team without going through invitations.
 */
export async function seedOrgWithTeam(
  name = `Test Ground ${randomBytes(3).toString('hex')}`,
  opts: { plan?: PlanId } = {},
): Promise<FixtureOrg> {
  const org = await Organization.create({ name, slug: `t-${randomBytes(6).toString('hex')}` });
  // On the largest plan unless a test asks otherwise, so plan limits stay out of tests about other things.
  const plan = opts.plan ?? 'office';
  if (plan !== 'bench') await BillingAccount.create(accountRow(org.id, { plan, status: 'active' }));
  const users = {} as Record<Role, FixtureUser>;
  for (const role of roles) {
    const password = `pw-${role}-${randomBytes(6).toString('hex')}`;
    const email = uniqueEmail(role);
    const user = await User.create({
      email,
      name: `${role} of ${name}`,
      passwordHash: await bcrypt.hash(password, 4),
    });
    await Membership.create({ organizationId: org.id, userId: user.id, role });
    users[role] = { id: user.id, email, name: user.name, password, role };
  }
  return { id: org.id, name, users };
}

/**
 * Every row of every table, as one string per table: compare a snapshot before and after a request
 * to show it changed nothing stored.
 */
export async function snapshotTables(
  sequelize: Sequelize,
  except: string[] = [],
): Promise<Record<string, string>> {
  const tables = await sequelize.query<{ t: string }>(
    "SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE' ORDER BY table_name",
    { type: QueryTypes.SELECT },
  );
  const out: Record<string, string> = {};
  for (const { t } of tables) {
    // Rate-limit counters count requests, whatever their answer: they are not the data a request changes.
    if (except.includes(t) || t === 'schema_migrations' || t === 'rate_limit_counters') continue;
    const rows = await sequelize.query(`SELECT * FROM \`${t}\` ORDER BY 1`, { type: QueryTypes.SELECT });
    out[t] = JSON.stringify(rows, (_k, v: unknown) => (typeof v === 'bigint' ? v.toString() : v));
  }
  return out;
}

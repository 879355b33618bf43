import type { Sequelize } from 'sequelize';
import type { Role } from '@wickstone/contracts';
import { DEFAULT_BCRYPT_COST } from '../../config.js';
import { hashPassword, isCommonPassword, verifyPassword } from '../../auth/passwords.js';
import { Membership, Organization, User } from '../models/index.js';

/** The demo's password, the same for every demo user; printed by `npm start`, so demo only. */
export const DEMO_PASSWORD = 'capillary-demo-2026';

/** The demo's invented staff, one per role. */
export const demoUsers: ReadonlyArray<{ role: Role; name: string; email: string; password: string }> = [
  {
    role: 'owner',
    name: 'Olivia Marsh',
    email: 'olivia.marsh@brackenridge-ground.example',
    password: DEMO_PASSWORD,
  },
  {
    role: 'admin',
    name: 'Arjun Pell',
    email: 'arjun.pell@brackenridge-ground.example',
    password: DEMO_PASSWORD,
  },
  {
    role: 'analyst',
    name: 'Nadia Frost',
    email: 'nadia.frost@brackenridge-ground.example',
    password: DEMO_PASSWORD,
  },
  {
    role: 'developer',
    name: 'Tomás Reyes',
    email: 'tomas.reyes@brackenridge-ground.example',
    password: DEMO_PASSWORD,
  },
];

/**
 * The demo scenario: an invented consultancy, Brackenridge Ground & Damp, whose site is
 * brackenridge-ground.example, with one member per role. Idempotent: running it again creates what
 * is missing and changes nothing that exists (a demo password changed by hand stays changed, and
 * the summary says so). Returns the lines `npm start` prints.
 */
export async function seedDemo(sequelize: Sequelize, options: { bcryptCost?: number } = {}): Promise<string> {
  const cost = options.bcryptCost ?? DEFAULT_BCRYPT_COST;
  for (const u of demoUsers)
    if (isCommonPassword(u.password)) throw new Error(`demo password of ${u.email} is a common one`);
  // Hash outside the transaction, and only for users still missing: a quarter second each.
  const present = new Set(
    (await User.findAll({ where: { email: demoUsers.map((u) => u.email) }, attributes: ['email'] })).map(
      (u) => u.email,
    ),
  );
  const hashes = new Map<string, string>();
  for (const u of demoUsers)
    if (!present.has(u.email)) hashes.set(u.email, await hashPassword(u.password, cost));

  const { org, users } = await sequelize.transaction(async (transaction) => {
    const [org] = await Organization.findOrCreate({
      where: { slug: 'brackenridge-ground' },
      defaults: { name: 'Brackenridge Ground & Damp', slug: 'brackenridge-ground' },
      transaction,
    });
    const users: Array<{ user: User; role: Role; password: string; created: boolean }> = [];
    for (const u of demoUsers) {
      const [user, created] = await User.findOrCreate({
        where: { email: u.email },
        defaults: { email: u.email, name: u.name, passwordHash: hashes.get(u.email) ?? '' },
        transaction,
      });
      const [membership] = await Membership.findOrCreate({
        where: { organizationId: org.id, userId: user.id },
        defaults: { organizationId: org.id, userId: user.id, role: u.role },
        transaction,
      });
      users.push({ user, role: membership.role, password: u.password, created });
    }
    return { org, users };
  });

  const lines = [`demo organisation: ${org.name} (id ${org.id}), sign in at the dashboard with:`];
  for (const { user, role, password, created } of users) {
    const still = created || (await verifyPassword(password, user.passwordHash, cost));
    const shown = still ? password : '(password changed since the demo was seeded)';
    lines.push(`  ${role.padEnd(9)} ${user.email.padEnd(36)} ${shown}`);
  }
  return lines.join('\n');
}

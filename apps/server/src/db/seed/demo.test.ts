import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Membership, Organization, User } from '../models/index.js';
import { TestClient, createTestApp, type TestApp } from '../../../testing/client.js';
import { snapshotTables } from '../../../testing/fixtures.js';
import { DEMO_PASSWORD, demoUsers, seedDemo } from './demo.js';

describe('the demo seed', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  it('makes the invented consultancy with one member per role and prints their sign-ins', async () => {
    const summary = await seedDemo(t.db.sequelize, { bcryptCost: 4 });
    expect(summary).toContain('Brackenridge Ground & Damp');
    for (const u of demoUsers)
      expect(summary).toMatch(
        new RegExp(`${u.role}\\s+${u.email.replace(/\./g, '\\.')}\\s+${DEMO_PASSWORD}`),
      );
    const org = await Organization.findOne({ where: { slug: 'brackenridge-ground' } });
    const roles = (await Membership.findAll({ where: { organizationId: org!.id } }))
      .map((m) => m.role)
      .sort();
    expect(roles).toEqual(['admin', 'analyst', 'developer', 'owner']);
    expect(demoUsers.every((u) => u.email.endsWith('@brackenridge-ground.example'))).toBe(true);
  });

  it('lets each demo user sign in with the printed password', async () => {
    for (const u of demoUsers) {
      const me = (await new TestClient(t.app).login(u.email, u.password)).body as {
        memberships: Array<{ role: string }>;
      };
      expect(me.memberships.map((m) => m.role)).toEqual([u.role]);
    }
  });

  it('is idempotent: a second run changes nothing, and says so when a password was changed by hand', async () => {
    const before = await snapshotTables(t.db.sequelize, ['audit_events']);
    await seedDemo(t.db.sequelize, { bcryptCost: 4 });
    expect(await snapshotTables(t.db.sequelize, ['audit_events'])).toEqual(before);

    await User.update(
      { passwordHash: '$2b$04$abcdefghijklmnopqrstuuJ3pUJ7pJ3pUJ7pJ3pUJ7pJ3pUJ7pJ3p' },
      { where: { email: demoUsers[0]!.email } },
    );
    const summary = await seedDemo(t.db.sequelize, { bcryptCost: 4 });
    expect(summary).toMatch(
      new RegExp(`owner\\s+${demoUsers[0]!.email.replace(/\./g, '\\.')}\\s+\\(password changed`),
    );
  });
});

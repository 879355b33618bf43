import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { errorBodySchema, meResponseSchema } from '@wickstone/contracts';
import { TestClient, createTestApp, linkToken, mailbox, type TestApp } from '../../testing/client.js';
import { uniqueEmail } from '../../testing/fixtures.js';

describe('sign-up, sign-in, sign-out and password reset', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  const signup = async (
    client: TestClient,
    email = uniqueEmail('signup'),
    password = 'capillary-fringe-42',
  ) => {
    const res = await client.post('/auth/signup', {
      organizationName: 'Fenland Damp Survey',
      name: 'Ada Marsh',
      email,
      password,
    });
    return { res, email, password };
  };

  it('signs up an owner of a new organisation and is signed in as them', async () => {
    const client = new TestClient(t.app);
    const { res, email } = await signup(client);
    expect(res.status).toBe(201);
    const me = meResponseSchema.parse((await client.get('/auth/me').expect(200)).body);
    expect(me.user.email).toBe(email);
    expect(me.memberships).toEqual([
      { organizationId: expect.any(Number), organizationName: 'Fenland Damp Survey', role: 'owner' },
    ]);
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/wst_session=[^;]+; Max-Age=\d+; Path=\/; Expires=[^;]+; HttpOnly; SameSite=Lax/);
  });

  it('stores the password as a bcrypt hash at the configured cost, never in clear', async () => {
    const client = new TestClient(t.app);
    const { email, password } = await signup(client);
    const [row] = await t.db.sequelize.query<{ password_hash: string }>(
      'SELECT password_hash FROM users WHERE email = ?',
      {
        replacements: [email],
        type: QueryTypes.SELECT,
      },
    );
    expect(row?.password_hash).toMatch(/^\$2b\$04\$/);
    expect(row?.password_hash).not.toContain(password);
  });

  it('lower-cases the address, so a second sign-up with different case is a conflict', async () => {
    const client = new TestClient(t.app);
    const { email } = await signup(client);
    const again = await signup(new TestClient(t.app), email.toUpperCase());
    expect(again.res.status).toBe(409);
    expect(errorBodySchema.parse(again.res.body).error.details).toEqual({
      fields: [{ field: 'body.email', message: 'Already has an account' }],
    });
  });

  it('refuses common passwords and passwords bcrypt would truncate', async () => {
    for (const [password, message] of [
      ['Password1', /most common/],
      ['iloveyou', /most common/],
      ['é'.repeat(37), /72 bytes/],
      ['short', /8 characters/],
    ] as const) {
      const { res } = await signup(new TestClient(t.app), uniqueEmail('weak'), password);
      expect(res.status, password).toBe(400);
      const fields = (
        res.body as { error: { details: { fields: Array<{ field: string; message: string }> } } }
      ).error.details.fields;
      expect(fields).toEqual([{ field: 'body.password', message: expect.stringMatching(message) }]);
    }
  });

  it('signs in and out; after sign-out the old session cookie no longer works', async () => {
    const { email, password } = await signup(new TestClient(t.app));
    const client = new TestClient(t.app);
    await client.get('/auth/me').expect(401);
    const login = await client.login(email, password);
    expect(meResponseSchema.parse(login.body).user.email).toBe(email);
    const sessionCookie = String(login.headers['set-cookie']).split(';')[0] ?? '';
    await client.get('/auth/me').expect(200);
    await client.post('/auth/logout').expect(204);
    await client.get('/auth/me').expect(401);
    // A copy of the cookie kept from before the sign-out (a stolen one) is refused too.
    const replay = await new TestClient(t.app).agent.get('/api/v1/auth/me').set('Cookie', sessionCookie);
    expect(replay.status).toBe(401);
    expect(replay.body.error.message).toMatch(/signed out/);
    // Signing out again is harmless.
    await client.post('/auth/logout').expect(204);
  });

  it('answers a wrong password and an unknown address alike', async () => {
    const { email } = await signup(new TestClient(t.app));
    const wrong = await new TestClient(t.app).post('/auth/login', { email, password: 'not-the-password' });
    const unknown = await new TestClient(t.app).post('/auth/login', {
      email: uniqueEmail('nobody'),
      password: 'not-the-password',
    });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
  });

  it('changes name and password in account settings; other sessions end, this one goes on', async () => {
    const { email, password } = await signup(new TestClient(t.app));
    const here = new TestClient(t.app);
    const elsewhere = new TestClient(t.app);
    await here.login(email, password);
    await elsewhere.login(email, password);
    const wrong = await here.patch('/auth/me', {
      currentPassword: 'nope-nope-nope',
      newPassword: 'meniscus-weight-77',
    });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.details.fields[0].field).toBe('body.currentPassword');
    const ok = await here.patch('/auth/me', {
      name: 'Ada Fen',
      currentPassword: password,
      newPassword: 'meniscus-weight-77',
    });
    expect(ok.status).toBe(200);
    expect(ok.body.user.name).toBe('Ada Fen');
    await here.get('/auth/me').expect(200);
    await elsewhere.get('/auth/me').expect(401);
    await new TestClient(t.app).login(email, 'meniscus-weight-77');
  });

  it('resets a password through the e-mailed link, once, and says the same for unknown addresses', async () => {
    const { email } = await signup(new TestClient(t.app));
    const nobody = uniqueEmail('nobody');
    const client = new TestClient(t.app);
    const known = await client.post('/auth/password/forgot', { email });
    const unknown = await client.post('/auth/password/forgot', { email: nobody });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(known.body).toEqual({ ok: true });
    expect(unknown.body).toEqual(known.body);

    const [message] = await mailbox(t.db.config.mail.fakeApiUrl, email);
    expect(message?.subject).toBe('Reset your Wickstone password');
    expect(message?.text).toContain(`${t.db.config.publicUrl}/reset-password?token=`);
    const token = linkToken(message!, 'reset-password');
    // Stored hashed: the token in the mail is not in the table.
    const rows = await t.db.sequelize.query<{ token_hash: string }>(
      'SELECT token_hash FROM password_resets',
      { type: QueryTypes.SELECT },
    );
    expect(rows.some((r) => r.token_hash === token)).toBe(false);

    await client.post('/auth/password/reset', { token, password: 'washburn-wicking-31' }).expect(204);
    const again = await client
      .post('/auth/password/reset', { token, password: 'washburn-wicking-32' })
      .expect(400);
    expect(again.body.error.details.fields).toEqual([{ field: 'body.token', message: expect.any(String) }]);
    await new TestClient(t.app).login(email, 'washburn-wicking-31');
    expect(await mailbox(t.db.config.mail.fakeApiUrl, nobody, 1, 300)).toEqual([]);
  });

  it('refuses an expired reset link', async () => {
    const { email } = await signup(new TestClient(t.app));
    const client = new TestClient(t.app);
    await client.post('/auth/password/forgot', { email }).expect(202);
    const [message] = await mailbox(t.db.config.mail.fakeApiUrl, email);
    await t.db.sequelize.query('UPDATE password_resets SET expires_at = NOW() - INTERVAL 1 MINUTE', {
      type: QueryTypes.UPDATE,
    });
    const res = await client.post('/auth/password/reset', {
      token: linkToken(message!, 'reset-password'),
      password: 'washburn-wicking-33',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.details.fields[0].field).toBe('body.token');
  });
});

import bcrypt from 'bcryptjs';
import { Op, UniqueConstraintError } from 'sequelize';
import type { MeResponse, SignupBody } from '@wickstone/contracts';
import { Membership, Organization, PasswordReset, User } from '../db/models/index.js';
import { AppError, fieldError } from '../errors.js';
import type { ServiceDeps } from '../service-deps.js';
import type { RequestMeta } from '../http/request-state.js';
import { sendSafely } from '../mail/mailer.js';
import { dashboardLink, passwordResetMail, signInFailuresMail } from '../mail/templates.js';
import { assertAcceptablePassword, hashPassword, verifyPassword } from './passwords.js';
import { hashLinkToken, newLinkToken } from './tokens.js';
import type { LoginThrottle } from './throttle.js';

export const RESET_TTL_MS = 60 * 60 * 1000;

export interface AuthService {
  signup(body: SignupBody, meta: RequestMeta): Promise<User>;
  /**
   * Check a password, throttled per account and client (`auth/throttle.ts`): `client` is the
   * client's address key, `device` the device cookie the browser sent, if any.
   */
  login(
    email: string,
    password: string,
    meta: RequestMeta,
    from: { client: string; device: { userId: number; deviceId: string } | null },
  ): Promise<User>;
  logout(user: User, meta: RequestMeta): Promise<void>;
  me(user: User): Promise<MeResponse>;
  updateAccount(
    user: User,
    change: {
      name?: string | undefined;
      currentPassword?: string | undefined;
      newPassword?: string | undefined;
    },
    meta: RequestMeta,
  ): Promise<{ user: User; passwordChanged: boolean }>;
  /** Always resolves the same way; mails a link only when the address has an account. */
  forgotPassword(email: string, meta: RequestMeta): Promise<void>;
  resetPassword(token: string, password: string, meta: RequestMeta): Promise<void>;
}

export function slugify(name: string): string {
  const base = name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .replace(/-+$/g, '');
  return base || 'organisation';
}

export function createAuthService(deps: ServiceDeps, throttle: LoginThrottle): AuthService {
  const { config, sequelize, audit, mailer, logger } = deps;
  const cost = config.auth.bcryptCost;

  async function uniqueSlug(name: string): Promise<string> {
    const base = slugify(name);
    const taken = await Organization.findAll({
      where: { slug: { [Op.or]: [base, { [Op.like]: `${base}-%` }] } },
      attributes: ['slug'],
    });
    const used = new Set(taken.map((o) => o.slug));
    if (!used.has(base)) return base;
    for (let n = 2; ; n++) if (!used.has(`${base}-${n}`)) return `${base}-${n}`;
  }

  return {
    async signup(body, meta) {
      assertAcceptablePassword(body.password, 'body.password');
      if (await User.findOne({ where: { email: body.email }, attributes: ['id'] })) {
        throw fieldError('body.email', 'Already has an account', {
          code: 'conflict',
          message: 'An account with this e-mail address already exists: sign in instead',
        });
      }
      const passwordHash = await hashPassword(body.password, cost);
      const slug = await uniqueSlug(body.organizationName);
      try {
        return await sequelize.transaction(async (transaction) => {
          const org = await Organization.create({ name: body.organizationName, slug }, { transaction });
          const user = await User.create(
            { email: body.email, name: body.name, passwordHash },
            { transaction },
          );
          await Membership.create(
            { organizationId: org.id, userId: user.id, role: 'owner' },
            { transaction },
          );
          await audit.record(
            org.id,
            {
              type: 'auth.signup',
              actorUserId: user.id,
              subject: user.email,
              details: { organizationName: org.name },
            },
            meta,
            transaction,
          );
          return user;
        });
      } catch (err) {
        // Two sign-ups racing for one address or one slug: the unique index decides.
        if (err instanceof UniqueConstraintError) {
          throw new AppError(
            'conflict',
            'That account or organisation was created a moment ago: try again',
            null,
            { cause: err },
          );
        }
        throw err;
      }
    },

    async login(email, password, meta, from) {
      const user = await User.findOne({ where: { email } });
      // The device cookie counts only for the account it was issued to.
      const deviceId = user && from.device?.userId === user.id ? from.device.deviceId : null;
      const who = { email, ip: from.client, deviceId };
      const verdict = await throttle.check(who);
      if (verdict.waitS > 0) {
        throw new AppError(
          'rate_limited',
          `Too many failed sign-ins: try again in ${verdict.waitS} second${verdict.waitS === 1 ? '' : 's'}`,
          { retryAfterS: verdict.waitS, slowedBy: verdict.slowedBy },
        );
      }
      const ok = await verifyPassword(password, user?.passwordHash ?? null, cost);
      if (!user || !ok) {
        const { notify, accountFailures } = await throttle.failed({ ...who, trusted: verdict.trusted });
        if (notify && user) {
          void sendSafely(
            mailer,
            logger,
            signInFailuresMail({
              to: user.email,
              name: user.name,
              failures: accountFailures,
              windowMinutes: Math.round(config.rateLimits.windowMs / 60_000),
              resetLink: dashboardLink(config.publicUrl, 'forgot-password'),
            }),
            'sign-in failures warning',
          );
        }
        const failed = {
          type: 'auth.login_failed' as const,
          actorUserId: null,
          subject: email,
          details: { email, reason: user ? 'wrong password' : 'unknown address' },
        };
        if (user) await audit.recordForUser(user.id, failed, meta);
        else await audit.record(null, failed, meta);
        throw new AppError('unauthenticated', 'Wrong e-mail address or password');
      }
      // Hashes made at a lower cost (before it was raised) are upgraded while the password is at hand.
      if (bcrypt.getRounds(user.passwordHash) < cost) {
        user.passwordHash = await hashPassword(password, cost);
        await user.save();
      }
      await throttle.succeeded(who);
      await audit.recordForUser(
        user.id,
        { type: 'auth.login', actorUserId: user.id, subject: user.email },
        meta,
      );
      return user;
    },

    async logout(user, meta) {
      await audit.recordForUser(
        user.id,
        { type: 'auth.logout', actorUserId: user.id, subject: user.email },
        meta,
      );
    },

    async me(user) {
      const memberships = await Membership.findAll({
        where: { userId: user.id },
        include: [{ model: Organization, as: 'organization', required: true }],
        order: [[{ model: Organization, as: 'organization' }, 'name', 'ASC']],
      });
      return {
        user: { id: user.id, name: user.name, email: user.email },
        memberships: memberships.map((m) => ({
          organizationId: m.organizationId,
          organizationName: m.organization?.name ?? '',
          role: m.role,
        })),
      };
    },

    async updateAccount(user, change, meta) {
      let passwordChanged = false;
      if (change.newPassword !== undefined) {
        assertAcceptablePassword(change.newPassword, 'body.newPassword');
        if (!(await verifyPassword(change.currentPassword ?? '', user.passwordHash, cost))) {
          throw fieldError('body.currentPassword', 'Not your current password');
        }
        user.passwordHash = await hashPassword(change.newPassword, cost);
        // Every other session of this account ends; the caller gets a fresh one.
        user.sessionVersion += 1;
        passwordChanged = true;
      }
      if (change.name !== undefined) user.name = change.name;
      await sequelize.transaction(async (transaction) => {
        await user.save({ transaction });
        if (passwordChanged) {
          await audit.recordForUser(
            user.id,
            {
              type: 'auth.password_reset',
              actorUserId: user.id,
              subject: user.email,
              details: { via: 'account settings' },
            },
            meta,
            transaction,
          );
        }
      });
      return { user, passwordChanged };
    },

    async forgotPassword(email, meta) {
      const user = await User.findOne({ where: { email } });
      if (!user) {
        logger.info({ ip: meta.ip }, 'password reset asked for an address with no account');
        return;
      }
      const { token, hash } = newLinkToken();
      const expiresAt = new Date(Date.now() + RESET_TTL_MS);
      await PasswordReset.create({ userId: user.id, tokenHash: hash, expiresAt });
      const link = dashboardLink(config.publicUrl, `reset-password?token=${encodeURIComponent(token)}`);
      // Not awaited: the answer must take the same time whether or not there is an account to mail.
      void sendSafely(
        mailer,
        logger,
        passwordResetMail({ to: user.email, name: user.name, link, expiresAt }),
        'password reset',
      );
    },

    async resetPassword(token, password, meta) {
      assertAcceptablePassword(password, 'body.password');
      const reset = await PasswordReset.findOne({ where: { tokenHash: hashLinkToken(token) } });
      const invalid = () =>
        fieldError('body.token', 'Used, expired or unknown: ask for a new link', {
          message: 'This reset link is not valid: it may have been used or have expired. Ask for a new one.',
        });
      if (!reset || reset.usedAt || reset.expiresAt.getTime() < Date.now()) throw invalid();
      const passwordHash = await hashPassword(password, cost);
      await sequelize.transaction(async (transaction) => {
        // Claim the token atomically: of two requests racing with one link, one wins.
        const [claimed] = await PasswordReset.update(
          { usedAt: new Date() },
          { where: { id: reset.id, usedAt: null, expiresAt: { [Op.gt]: new Date() } }, transaction },
        );
        if (claimed !== 1) throw invalid();
        const user = await User.findByPk(reset.userId, { transaction, lock: transaction.LOCK.UPDATE });
        if (!user) throw invalid();
        user.passwordHash = passwordHash;
        user.sessionVersion += 1;
        await user.save({ transaction });
        // Any other outstanding link for this account stops working too.
        await PasswordReset.update(
          { usedAt: new Date() },
          { where: { userId: user.id, usedAt: null }, transaction },
        );
        await audit.recordForUser(
          user.id,
          {
            type: 'auth.password_reset',
            actorUserId: user.id,
            subject: user.email,
            details: { via: 'e-mail link' },
          },
          meta,
          transaction,
        );
      });
    },
  };
}

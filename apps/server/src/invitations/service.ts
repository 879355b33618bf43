import { UniqueConstraintError } from 'sequelize';
import { canAssignRole, newPasswordSchema, type Role } from '@wickstone/contracts';
import type { z } from 'zod';
import type { invitationPreviewSchema, invitationSchema } from '@wickstone/contracts';
import { Invitation, Membership, Organization, User } from '../db/models/index.js';
import { AppError, fieldError } from '../errors.js';
import type { ServiceDeps } from '../service-deps.js';
import { assertAcceptablePassword, hashPassword, verifyPassword } from '../auth/passwords.js';
import { hashLinkToken, newLinkToken } from '../auth/tokens.js';
import type { OrgScope, RequestMeta } from '../http/request-state.js';
import { sendSafely } from '../mail/mailer.js';
import { dashboardLink, invitationMail } from '../mail/templates.js';

export type InvitationDto = z.infer<typeof invitationSchema>;
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

export const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;

export function invitationDto(i: Invitation): InvitationDto {
  return {
    id: i.id,
    email: i.email,
    role: i.role,
    invitedBy: i.invitedBy?.name ?? 'a former member',
    expiresAt: i.expiresAt.toISOString(),
    createdAt: i.createdAt.toISOString(),
  };
}

export interface Inviter {
  user: User;
  org: OrgScope;
}

export interface InvitationService {
  invite(inviter: Inviter, email: string, role: Role, meta: RequestMeta): Promise<InvitationDto>;
  /** A new link (the old one stops working: only a hash is kept, so it cannot be sent again). */
  resend(inviter: Inviter, invitationId: number, meta: RequestMeta): Promise<InvitationDto>;
  revoke(inviter: Inviter, invitationId: number, meta: RequestMeta): Promise<void>;
  preview(token: string): Promise<InvitationPreview>;
  /** Join the organisation as the invited address; returns the user to sign in. */
  accept(
    token: string,
    body: { name?: string | undefined; password?: string | undefined },
    signedIn: User | null,
    meta: RequestMeta,
  ): Promise<User>;
}

const notFound = () =>
  new AppError(
    'not_found',
    'This invitation is not valid: it may have been used, withdrawn or have expired.',
  );

export function createInvitationService(deps: ServiceDeps): InvitationService {
  const { config, sequelize, audit, mailer, logger } = deps;
  const cost = config.auth.bcryptCost;

  async function mail(inv: Invitation, token: string, inviter: Inviter): Promise<void> {
    const link = dashboardLink(config.publicUrl, `invitations/${encodeURIComponent(token)}`);
    await sendSafely(
      mailer,
      logger,
      invitationMail({
        to: inv.email,
        organizationName: inviter.org.name,
        inviterName: inviter.user.name,
        role: inv.role,
        link,
        expiresAt: inv.expiresAt,
      }),
      'invitation',
    );
  }

  /**
   * A pending invitation of the inviter's organisation (scoped: another organisation's id is a 404)
   * that the inviter may act on: only an owner re-sends or withdraws an invitation to be an owner.
   */
  async function manageable(inviter: Inviter, invitationId: number, action: string): Promise<Invitation> {
    const inv = await Invitation.findOne({
      where: { id: invitationId, organizationId: inviter.org.id, acceptedAt: null },
    });
    if (!inv) throw new AppError('not_found', 'Invitation not found');
    if (!canAssignRole(inviter.org.role, inv.role)) {
      throw new AppError('forbidden', `Only an owner can ${action} an invitation to be ${inv.role}`);
    }
    return inv;
  }

  async function usable(token: string): Promise<Invitation> {
    const inv = await Invitation.findOne({
      where: { tokenHash: hashLinkToken(token) },
      include: [{ model: Organization, as: 'organization', required: true }],
    });
    if (!inv || inv.acceptedAt || inv.expiresAt.getTime() < Date.now()) throw notFound();
    return inv;
  }

  return {
    async invite(inviter, email, role, meta) {
      if (!canAssignRole(inviter.org.role, role))
        throw new AppError('forbidden', `Only an owner can invite an ${role}`);
      const existing = await User.findOne({ where: { email }, attributes: ['id'] });
      if (
        existing &&
        (await Membership.findOne({
          where: { organizationId: inviter.org.id, userId: existing.id },
          attributes: ['id'],
        }))
      ) {
        throw fieldError('body.email', 'Already a member', {
          code: 'conflict',
          message: 'This person is already a member',
        });
      }
      const { token, hash } = newLinkToken();
      const inv = await sequelize.transaction(async (transaction) => {
        // Inviting an address again replaces its pending invitation: one live link per address.
        await Invitation.destroy({
          where: { organizationId: inviter.org.id, email, acceptedAt: null },
          transaction,
        });
        const created = await Invitation.create(
          {
            organizationId: inviter.org.id,
            email,
            role,
            tokenHash: hash,
            invitedByUserId: inviter.user.id,
            expiresAt: new Date(Date.now() + INVITATION_TTL_MS),
          },
          { transaction },
        );
        await audit.record(
          inviter.org.id,
          {
            type: 'member.invited',
            actorUserId: inviter.user.id,
            subject: email,
            details: { role, invitationId: created.id },
          },
          meta,
          transaction,
        );
        return created;
      });
      inv.invitedBy = inviter.user;
      // After the commit: a mail failure is logged and the invitation stays, to be re-sent.
      await mail(inv, token, inviter);
      return invitationDto(inv);
    },

    async resend(inviter, invitationId, meta) {
      const inv = await manageable(inviter, invitationId, 'send');
      const { token, hash } = newLinkToken();
      inv.tokenHash = hash;
      inv.expiresAt = new Date(Date.now() + INVITATION_TTL_MS);
      inv.invitedByUserId = inviter.user.id;
      await sequelize.transaction(async (transaction) => {
        await inv.save({ transaction });
        await audit.record(
          inviter.org.id,
          {
            type: 'member.invited',
            actorUserId: inviter.user.id,
            subject: inv.email,
            details: { role: inv.role, invitationId: inv.id, resent: true },
          },
          meta,
          transaction,
        );
      });
      inv.invitedBy = inviter.user;
      await mail(inv, token, inviter);
      return invitationDto(inv);
    },

    async revoke(inviter, invitationId, meta) {
      const inv = await manageable(inviter, invitationId, 'withdraw');
      await sequelize.transaction(async (transaction) => {
        await Invitation.destroy({ where: { id: inv.id, organizationId: inviter.org.id }, transaction });
        // Recorded as a removal of someone not yet in (no type of its own in the contracts' list yet).
        await audit.record(
          inviter.org.id,
          {
            type: 'member.removed',
            actorUserId: inviter.user.id,
            subject: inv.email,
            details: { role: inv.role, invitationId: inv.id, pendingInvitation: true },
          },
          meta,
          transaction,
        );
      });
    },

    async preview(token) {
      const inv = await usable(token);
      const existingUser = (await User.count({ where: { email: inv.email } })) > 0;
      return {
        email: inv.email,
        role: inv.role,
        organizationName: inv.organization?.name ?? '',
        existingUser,
        expiresAt: inv.expiresAt.toISOString(),
      };
    },

    async accept(token, body, signedIn, meta) {
      const inv = await usable(token);
      const existing = await User.findOne({ where: { email: inv.email } });
      let passwordHash: string | null = null;
      if (existing) {
        // The invited account itself: signed in as it, or proving it with its password.
        if (signedIn?.id !== existing.id) {
          if (body.password === undefined)
            throw fieldError('body.password', `Required: the password of your account (${inv.email})`);
          if (!(await verifyPassword(body.password, existing.passwordHash, cost))) {
            throw fieldError('body.password', 'Wrong password', {
              code: 'unauthenticated',
              message: `Wrong password for ${inv.email}`,
            });
          }
        }
      } else {
        if (body.name === undefined) throw fieldError('body.name', 'Required for a new account');
        if (body.password === undefined) throw fieldError('body.password', 'Required for a new account');
        const rules = newPasswordSchema.safeParse(body.password);
        if (!rules.success)
          throw fieldError('body.password', rules.error.issues[0]?.message ?? 'Not an acceptable password');
        assertAcceptablePassword(body.password, 'body.password');
        passwordHash = await hashPassword(body.password, cost);
      }

      try {
        return await sequelize.transaction(async (transaction) => {
          // Claim the invitation under a row lock: a link works once, even when clicked twice at once.
          const locked = await Invitation.findOne({
            where: { id: inv.id },
            lock: transaction.LOCK.UPDATE,
            transaction,
          });
          if (
            !locked ||
            locked.acceptedAt ||
            locked.tokenHash !== inv.tokenHash ||
            locked.expiresAt.getTime() < Date.now()
          )
            throw notFound();
          const user =
            existing ??
            (await User.create(
              { email: inv.email, name: body.name ?? '', passwordHash: passwordHash ?? '' },
              { transaction },
            ));
          const already = await Membership.findOne({
            where: { organizationId: inv.organizationId, userId: user.id },
            transaction,
          });
          if (!already)
            await Membership.create(
              { organizationId: inv.organizationId, userId: user.id, role: locked.role },
              { transaction },
            );
          locked.acceptedAt = new Date();
          await locked.save({ transaction });
          await audit.record(
            inv.organizationId,
            {
              type: 'member.joined',
              actorUserId: user.id,
              subject: user.email,
              details: { role: already?.role ?? locked.role, invitationId: inv.id, newAccount: !existing },
            },
            meta,
            transaction,
          );
          return user;
        });
      } catch (err) {
        if (err instanceof UniqueConstraintError)
          throw new AppError(
            'conflict',
            'An account for this address was created a moment ago: sign in and open the link again',
            null,
            { cause: err },
          );
        throw err;
      }
    },
  };
}

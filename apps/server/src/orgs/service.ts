import { Op, type Sequelize, type Transaction } from 'sequelize';
import {
  can,
  canAssignRole,
  type Member,
  type MembersResponse,
  type OrganizationResponse,
  type Role,
} from '@wickstone/contracts';
import { Invitation, Membership, User } from '../db/models/index.js';
import { AppError, fieldError } from '../errors.js';
import type { AuditService } from '../audit/service.js';
import type { OrgScope, RequestMeta } from '../http/request-state.js';
import { invitationDto } from '../invitations/service.js';

/** The acting member: who they are and their role in the organisation being changed. */
export interface Actor {
  userId: number;
  org: OrgScope;
}

export interface OrgService {
  get(org: OrgScope): OrganizationResponse;
  listMembers(org: OrgScope, withInvitations: boolean): Promise<MembersResponse>;
  changeRole(actor: Actor, userId: number, role: Role, meta: RequestMeta): Promise<Member>;
  removeMember(actor: Actor, userId: number, meta: RequestMeta): Promise<void>;
}

function memberDto(m: Membership): Member {
  return {
    userId: m.userId,
    name: m.user?.name ?? '',
    email: m.user?.email ?? '',
    role: m.role,
    joinedAt: m.createdAt.toISOString(),
  };
}

const forbid = (message: string) => new AppError('forbidden', message);

export function createOrgService(deps: { sequelize: Sequelize; audit: AuditService }): OrgService {
  const { sequelize, audit } = deps;

  /** The target's membership of this organisation, locked; 404 for anyone not in it. */
  async function lockMember(orgId: number, userId: number, transaction: Transaction): Promise<Membership> {
    const m = await Membership.findOne({
      where: { organizationId: orgId, userId },
      include: [{ model: User, as: 'user', required: true }],
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    if (!m) throw new AppError('not_found', 'Member not found');
    return m;
  }

  /**
   * Lock the organisation's owner rows and count them, first thing in every change of a member, so
   * two owners demoting each other at once cannot leave it with none: the second waits for the
   * first and then sees one owner left. Taking this lock before the target's row keeps one lock
   * order for every change, so two changes cannot deadlock.
   */
  async function ownerCount(orgId: number, transaction: Transaction): Promise<number> {
    const owners = await Membership.findAll({
      where: { organizationId: orgId, role: 'owner' },
      attributes: ['id'],
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    return owners.length;
  }

  /**
   * The actor's role as it is now, under lock: one who was demoted or removed a moment ago (by a
   * change that committed while this request was on its way) acts with the role they have now.
   */
  async function currentRole(actor: Actor, transaction: Transaction): Promise<Role> {
    const m = await Membership.findOne({
      where: { organizationId: actor.org.id, userId: actor.userId },
      attributes: ['id', 'role'],
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    if (!m) throw new AppError('not_found', 'Organisation not found');
    if (!can(m.role, 'members:manage'))
      throw forbid(`Your role (${m.role}) may not do this (members:manage)`);
    return m.role;
  }

  return {
    get(org) {
      return { id: org.id, name: org.name, slug: org.slug, role: org.role };
    },

    async listMembers(org, withInvitations) {
      const members = await Membership.findAll({
        where: { organizationId: org.id },
        include: [{ model: User, as: 'user', required: true, attributes: ['id', 'name', 'email'] }],
        order: [
          ['createdAt', 'ASC'],
          ['id', 'ASC'],
        ],
      });
      const invitations = withInvitations
        ? await Invitation.findAll({
            where: { organizationId: org.id, acceptedAt: null, expiresAt: { [Op.gt]: new Date() } },
            include: [{ model: User, as: 'invitedBy', required: false, attributes: ['id', 'name'] }],
            order: [
              ['createdAt', 'DESC'],
              ['id', 'DESC'],
            ],
          })
        : [];
      return { items: members.map(memberDto), invitations: invitations.map(invitationDto) };
    },

    async changeRole(actor, userId, role, meta) {
      return sequelize.transaction(async (transaction) => {
        const owners = await ownerCount(actor.org.id, transaction);
        const actorRole = await currentRole(actor, transaction);
        const target = await lockMember(actor.org.id, userId, transaction);
        const from = target.role;
        // Taking the owner role away is as much an owner's decision as handing it out.
        if (!canAssignRole(actorRole, role)) throw forbid(`Only an owner can make someone ${role}`);
        if (!canAssignRole(actorRole, from)) throw forbid(`Only an owner can change an owner's role`);
        if (from === role) return memberDto(target);
        if (from === 'owner' && owners <= 1) {
          throw fieldError('body.role', 'The organisation needs at least one owner', {
            code: 'conflict',
            message: 'This is the last owner: make someone else an owner first',
          });
        }
        target.role = role;
        await target.save({ transaction });
        await audit.record(
          actor.org.id,
          {
            type: 'member.role_changed',
            actorUserId: actor.userId,
            subject: target.user?.email ?? null,
            details: { userId, from, to: role },
          },
          meta,
          transaction,
        );
        return memberDto(target);
      });
    },

    async removeMember(actor, userId, meta) {
      await sequelize.transaction(async (transaction) => {
        const owners = await ownerCount(actor.org.id, transaction);
        const actorRole = await currentRole(actor, transaction);
        const target = await lockMember(actor.org.id, userId, transaction);
        if (!canAssignRole(actorRole, target.role)) throw forbid(`Only an owner can remove an owner`);
        if (target.role === 'owner' && owners <= 1) {
          throw new AppError('conflict', 'This is the last owner: make someone else an owner first');
        }
        await target.destroy({ transaction });
        await audit.record(
          actor.org.id,
          {
            type: 'member.removed',
            actorUserId: actor.userId,
            subject: target.user?.email ?? null,
            details: { userId, role: target.role },
          },
          meta,
          transaction,
        );
      });
    },
  };
}

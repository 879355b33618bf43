import type { Transaction } from 'sequelize';
import type { AuditEntry } from '@wickstone/contracts';
import { AuditEvent, Membership, User, type AuditEventType } from '../db/models/index.js';
import type { RequestMeta } from '../http/request-state.js';

export interface AuditInput {
  type: AuditEventType;
  actorUserId: number | null;
  /** What the event is about, in words a reader recognises: usually an e-mail address. */
  subject?: string | null;
  details?: Record<string, unknown>;
}

/**
 * One change's audit entry, already bound to its organisation, actor and request: services that
 * change something take one of these and call it inside their own transaction, so the entry and the
 * change commit together (and neither without the other), and the service never sees the request.
 */
export type AuditTrail = (entry: Omit<AuditInput, 'actorUserId'>, transaction?: Transaction) => Promise<void>;

export function auditTrail(
  audit: AuditService,
  organizationId: number,
  actorUserId: number,
  meta: RequestMeta,
): AuditTrail {
  return (entry, transaction) => audit.record(organizationId, { ...entry, actorUserId }, meta, transaction);
}

export interface AuditService {
  /** One event in one organisation (or in none, for a failed sign-in of an unknown address). */
  record(
    organizationId: number | null,
    input: AuditInput,
    meta: RequestMeta,
    transaction?: Transaction,
  ): Promise<void>;
  /**
   * A person's own event (sign-in, failed sign-in, password reset): one row in each organisation
   * they belong to at that moment, so each organisation reads its own log with one scoped query and
   * keeps it after the person leaves; a person in no organisation gets a row in none.
   */
  recordForUser(
    userId: number,
    input: AuditInput,
    meta: RequestMeta,
    transaction?: Transaction,
  ): Promise<void>;
  /** One organisation's log, newest first. */
  list(
    organizationId: number,
    page: number,
    pageSize: number,
  ): Promise<{ items: AuditEntry[]; total: number }>;
}

export function createAuditService(): AuditService {
  const row = (organizationId: number | null, input: AuditInput, meta: RequestMeta) => ({
    organizationId,
    type: input.type,
    actorUserId: input.actorUserId,
    subject: input.subject?.slice(0, 254) ?? null,
    ip: meta.ip,
    details: input.details ?? {},
  });

  return {
    async record(organizationId, input, meta, transaction) {
      await AuditEvent.create(row(organizationId, input, meta), { transaction });
    },
    async recordForUser(userId, input, meta, transaction) {
      const memberships = await Membership.findAll({
        where: { userId },
        attributes: ['organizationId'],
        transaction,
      });
      const orgIds = memberships.map((m) => m.organizationId);
      const rows = orgIds.length ? orgIds.map((id) => row(id, input, meta)) : [row(null, input, meta)];
      await AuditEvent.bulkCreate(rows, { transaction });
    },
    async list(organizationId, page, pageSize) {
      const { rows, count } = await AuditEvent.findAndCountAll({
        where: { organizationId },
        include: [{ model: User, as: 'actor', attributes: ['id', 'name', 'email'], required: false }],
        order: [['id', 'DESC']],
        limit: pageSize,
        offset: (page - 1) * pageSize,
      });
      return {
        total: count,
        items: rows.map((e) => ({
          id: Number(e.id),
          type: e.type,
          actor: e.actor ? { id: e.actor.id, name: e.actor.name, email: e.actor.email } : null,
          subject: e.subject,
          ip: e.ip,
          details: e.details,
          createdAt: e.createdAt.toISOString(),
        })),
      };
    },
  };
}

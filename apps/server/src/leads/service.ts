import { Op, type Order, type Sequelize, type WhereOptions } from 'sequelize';
import type {
  AddLeadNoteBody,
  Lead as LeadDto,
  LeadNote as LeadNoteDto,
  LeadDetail,
  LeadFilters,
  LeadListQuery,
  LeadListResponse,
  UpdateLeadBody,
} from '@wickstone/contracts';
import { leadStatusWords } from '@wickstone/contracts';
import { Lead, LeadNote, Membership, Run, User, Widget } from '../db/models/index.js';
import { AppError, fieldError, notFound } from '../errors.js';
import { keysetCsv } from '../export/csv.js';
import type { AuditTrail } from '../audit/service.js';
import type { RunService } from '../runs/service.js';
import { retryOnDeadlock } from '../runs/store.js';
import { nextDay } from '../usage/days.js';

export interface LeadService {
  list(orgId: number, query: LeadListQuery): Promise<LeadListResponse>;
  /** One lead with the run it came from and that run's working (null once the run is gone). */
  get(orgId: number, leadId: number): Promise<LeadDetail>;
  /** `trail` records the change in the audit log (what changed, never the notes' text). */
  update(orgId: number, leadId: number, body: UpdateLeadBody, trail?: AuditTrail): Promise<LeadDto>;
  /**
   * Erase the visitor's personal data (name, contact details, message, site address) and the
   * firm's notes about them; status and timestamps stay, `erasedAt` is set, and the run stays
   * linked so usage statistics do not change. Erasing again changes nothing.
   */
  erase(orgId: number, leadId: number, trail?: AuditTrail): Promise<LeadDto>;
  /** Add a dated note by `authorId`; refused once the lead's personal data was erased. */
  addNote(
    orgId: number,
    leadId: number,
    authorId: number,
    body: AddLeadNoteBody,
    trail?: AuditTrail,
  ): Promise<LeadNoteDto>;
  exportCsv(orgId: number, filters: LeadFilters): AsyncGenerator<string>;
}

const EXPORT_CHUNK = 1000;

/** `LIKE` matches these literally only when escaped; a search for "50%" means the characters. */
const likeContains = (q: string) => `%${q.replace(/[\\%_]/g, '\\$&')}%`;

function leadsWhere(orgId: number, f: LeadFilters): WhereOptions<Lead> {
  const and: WhereOptions<Lead>[] = [{ organizationId: orgId }];
  if (f.status) and.push({ status: f.status });
  if (f.widgetId !== undefined) and.push({ widgetId: f.widgetId });
  if (f.assigneeId !== undefined) and.push({ assigneeId: f.assigneeId === 'none' ? null : f.assigneeId });
  if (f.from) and.push({ createdAt: { [Op.gte]: new Date(`${f.from}T00:00:00Z`) } });
  if (f.to) and.push({ createdAt: { [Op.lt]: new Date(`${nextDay(f.to)}T00:00:00Z`) } });
  if (f.q) {
    const pattern = likeContains(f.q);
    and.push({
      [Op.or]: [
        { name: { [Op.like]: pattern } },
        { email: { [Op.like]: pattern } },
        { company: { [Op.like]: pattern } },
      ],
    });
  }
  return { [Op.and]: and };
}

const sortOf = (sort: LeadFilters['sort']) => {
  const column = sort.endsWith('updatedAt') ? ('updatedAt' as const) : ('createdAt' as const);
  const dir = sort.startsWith('-') ? ('DESC' as const) : ('ASC' as const);
  return {
    column,
    dir,
    order: [
      [column, dir],
      ['id', dir],
    ] as Order,
  };
};

export function createLeadService(deps: { sequelize: Sequelize; runs: RunService }): LeadService {
  const { sequelize, runs } = deps;

  async function lookups(orgId: number, leads: Lead[]) {
    const assigneeIds = [
      ...new Set(leads.map((l) => l.assigneeId).filter((id): id is number => id !== null)),
    ];
    const [widgets, users, notes] = await Promise.all([
      Widget.findAll({ where: { organizationId: orgId }, attributes: ['id', 'name'] }),
      assigneeIds.length
        ? User.findAll({ where: { id: assigneeIds }, attributes: ['id', 'name', 'email'] })
        : Promise.resolve([]),
      leads.length
        ? LeadNote.findAll({
            where: { organizationId: orgId, leadId: leads.map((l) => l.id) },
            include: [{ model: User, as: 'author', attributes: ['id', 'name'], required: false }],
            order: [['id', 'ASC']],
          })
        : Promise.resolve([]),
    ]);
    const notesByLead = new Map<number, LeadNoteDto[]>();
    for (const n of notes) {
      const list = notesByLead.get(n.leadId) ?? [];
      list.push(noteDto(n));
      notesByLead.set(n.leadId, list);
    }
    return {
      widgets: new Map(widgets.map((w) => [w.id, w.name])),
      users: new Map(users.map((u) => [u.id, u])),
      notes: notesByLead,
    };
  }

  function noteDto(n: LeadNote): LeadNoteDto {
    return {
      id: n.id,
      body: n.body,
      createdAt: n.createdAt.toISOString(),
      author: n.author ? { id: n.author.id, name: n.author.name } : null,
    };
  }

  function toDto(l: Lead, look: Awaited<ReturnType<typeof lookups>>): LeadDto {
    const a = l.assigneeId === null ? undefined : look.users.get(l.assigneeId);
    return {
      id: l.id,
      createdAt: l.createdAt.toISOString(),
      updatedAt: l.updatedAt.toISOString(),
      status: l.status,
      widget: { id: l.widgetId, name: look.widgets.get(l.widgetId) ?? `Widget ${l.widgetId}` },
      runId: l.runId,
      name: l.name,
      email: l.email,
      company: l.company,
      phone: l.phone,
      message: l.message,
      siteAddress: l.siteAddress,
      origin: l.origin,
      consentText: l.consentText,
      consentAt: l.consentAt.toISOString(),
      sendCopy: l.sendCopy,
      assignee: a ? { id: a.id, name: a.name, email: a.email } : null,
      notes: look.notes.get(l.id) ?? [],
      erasedAt: l.erasedAt?.toISOString() ?? null,
    };
  }

  async function one(orgId: number, leadId: number): Promise<Lead> {
    const lead = await Lead.findOne({ where: { id: leadId, organizationId: orgId } });
    if (!lead) throw notFound('Lead');
    return lead;
  }

  const dtoOf = async (orgId: number, lead: Lead) => toDto(lead, await lookups(orgId, [lead]));

  return {
    async list(orgId, q) {
      const { rows, count } = await Lead.findAndCountAll({
        where: leadsWhere(orgId, q),
        order: sortOf(q.sort).order,
        limit: q.pageSize,
        offset: (q.page - 1) * q.pageSize,
      });
      const look = await lookups(orgId, rows);
      return { items: rows.map((l) => toDto(l, look)), total: count };
    },

    async get(orgId, leadId) {
      const lead = await one(orgId, leadId);
      // The link is cleared when a run is purged; a run missing anyway is shown as gone, not as an error.
      const run = lead.runId
        ? await runs.get(orgId, lead.runId).catch((e: unknown) => {
            if (e instanceof AppError && e.code === 'not_found') return null;
            throw e;
          })
        : null;
      return { ...(await dtoOf(orgId, lead)), run };
    },

    async update(orgId, leadId, body, trail) {
      const lead = await one(orgId, leadId);
      if (body.assigneeId != null) {
        const member = await Membership.count({ where: { organizationId: orgId, userId: body.assigneeId } });
        if (!member) throw fieldError('body.assigneeId', 'Not a member of this organisation');
      }
      const changes: Partial<Pick<Lead, 'status' | 'assigneeId'>> = {};
      if (body.status !== undefined) changes.status = body.status;
      if (body.assigneeId !== undefined) changes.assigneeId = body.assigneeId;
      const before = { status: lead.status, assigneeId: lead.assigneeId };
      if (Object.keys(changes).length) {
        await sequelize.transaction(async (transaction) => {
          await lead.update(changes, { transaction });
          const details: Record<string, unknown> = { leadId: lead.id };
          if (changes.status !== undefined && changes.status !== before.status)
            details.status = { from: before.status, to: changes.status };
          if (changes.assigneeId !== undefined && changes.assigneeId !== before.assigneeId)
            details.assigneeId = { from: before.assigneeId, to: changes.assigneeId };
          if (Object.keys(details).length > 1)
            await trail?.({ type: 'lead.updated', subject: `enquiry ${lead.id}`, details }, transaction);
        });
      }
      return dtoOf(orgId, lead);
    },

    async erase(orgId, leadId, trail) {
      await one(orgId, leadId);
      const erased = await retryOnDeadlock(() =>
        sequelize.transaction(async (transaction) => {
          const lead = await Lead.findOne({
            where: { id: leadId, organizationId: orgId },
            lock: transaction.LOCK.UPDATE,
            transaction,
          });
          if (!lead) throw notFound('Lead');
          const first = lead.erasedAt === null;
          // The link to the run stays: it is no one's personal data, and usage statistics ("runs that
          // led to an enquiry") must not change when a person's details are erased.
          await lead.update(
            {
              name: null,
              email: null,
              company: null,
              phone: null,
              message: null,
              siteAddress: null,
              erasedAt: lead.erasedAt ?? new Date(),
            },
            // The lead's own timestamps are kept; erasedAt says when this happened.
            { transaction, silent: true },
          );
          // The firm's notes are about the person: they go too.
          await LeadNote.destroy({ where: { leadId: lead.id, organizationId: orgId }, transaction });
          // So does the project block the visitor typed for the run's sheet ("prepared for" names someone).
          if (lead.runId !== null)
            await Run.update(
              { sheetProject: null },
              { where: { id: lead.runId, organizationId: orgId }, transaction },
            );
          if (first)
            await trail?.(
              { type: 'lead.erased', subject: `enquiry ${lead.id}`, details: { leadId: lead.id } },
              transaction,
            );
          return lead;
        }),
      );
      return dtoOf(orgId, erased);
    },

    async addNote(orgId, leadId, authorId, body, trail) {
      return sequelize.transaction(async (transaction) => {
        const lead = await Lead.findOne({
          where: { id: leadId, organizationId: orgId },
          lock: transaction.LOCK.UPDATE,
          transaction,
        });
        if (!lead) throw notFound('Lead');
        if (lead.erasedAt)
          throw fieldError('body.body', "This enquiry's personal data was erased: it takes no more notes");
        const note = await LeadNote.create(
          { organizationId: orgId, leadId, authorUserId: authorId, body: body.body },
          { transaction },
        );
        // The lead was worked on: it moves up a list sorted by last update.
        lead.changed('updatedAt', true);
        await lead.save({ transaction });
        await trail?.(
          { type: 'lead.note_added', subject: `enquiry ${leadId}`, details: { leadId } },
          transaction,
        );
        const author = await User.findByPk(authorId, { attributes: ['id', 'name'], transaction });
        return { ...noteDto(note), author: author ? { id: author.id, name: author.name } : null };
      });
    },

    async *exportCsv(orgId, f) {
      const where = leadsWhere(orgId, f);
      const { column, dir, order } = sortOf(f.sort);
      const after = dir === 'DESC' ? Op.lt : Op.gt;
      yield* keysetCsv<Lead, { at: Date; id: number }>({
        header: [
          'Lead',
          'Received (UTC)',
          'Updated (UTC)',
          'Status',
          'Widget',
          'Name',
          'E-mail',
          'Company',
          'Phone',
          'Site address',
          'Message',
          'Assignee',
          'Notes',
          'Site',
          'Run',
          'Erased (UTC)',
        ],
        chunk: EXPORT_CHUNK,
        page: (cursor) =>
          Lead.findAll({
            where: cursor
              ? {
                  [Op.and]: [
                    where,
                    {
                      [Op.or]: [
                        { [column]: { [after]: cursor.at } },
                        { [column]: cursor.at, id: { [after]: cursor.id } },
                      ],
                    },
                  ],
                }
              : where,
            order,
            limit: EXPORT_CHUNK,
          }),
        cursor: (last) => ({ at: last[column], id: last.id }),
        cells: async (rows) => {
          const look = await lookups(orgId, rows);
          return rows.map((row) => {
            const l = toDto(row, look);
            return [
              l.id,
              l.createdAt,
              l.updatedAt,
              // People read the export: the status in words, as the dashboard shows it.
              leadStatusWords[l.status],
              l.widget.name,
              l.name,
              l.email,
              l.company,
              l.phone,
              l.siteAddress,
              l.message,
              l.assignee?.name ?? null,
              l.notes
                .map(
                  (n) =>
                    `${n.createdAt.slice(0, 16).replace('T', ' ')} ${n.author?.name ?? 'former member'}: ${n.body}`,
                )
                .join('\n'),
              l.origin,
              l.runId,
              l.erasedAt,
            ];
          });
        },
      });
    },
  };
}

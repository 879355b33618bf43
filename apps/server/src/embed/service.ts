import { createHash } from 'node:crypto';
import { Op, QueryTypes, UniqueConstraintError, type Sequelize } from 'sequelize';
import type { Logger } from 'pino';
import {
  CalcInputError,
  calculate,
  canonicalJson,
  getCalculator,
  type CalculationResult,
  type JsonValue,
} from '@wickstone/calc-core';
import type { EmbedLeadBody, EmbedRunBody, EmbedWidget, LeadFieldId } from '@wickstone/contracts';
import { leadFieldIds } from '@wickstone/contracts';
import { Asset, Lead, Membership, Organization, Run, User, Widget } from '../db/models/index.js';
import { AppError } from '../errors.js';
import { sendSafely, type Mailer } from '../mail/mailer.js';
import { assetUrl } from '../widgets/service.js';
import { leadNotificationMail, resultCopyMail } from './mail.js';
import type { SheetService } from '../sheets/service.js';
import { retryOnDeadlock, storeRuns, type RunRow } from '../runs/store.js';
import { countLeads, ROLLUP_COLUMNS, rollupRunOf, type RollupColumnsRow } from '../usage/rollups.js';

export interface EmbedService {
  widgetFor(publicKey: string, origin: string | undefined): Promise<EmbedWidget>;
  recordRun(
    body: EmbedRunBody,
    origin: string | undefined,
  ): Promise<{ id: string; agreed: boolean; duplicate: boolean }>;
  recordLead(body: EmbedLeadBody, origin: string | undefined): Promise<{ id: number }>;
  /** Whether any live widget lets this origin embed it (for CORS preflight). */
  originKnown(origin: string): Promise<boolean>;
  asset(id: number): Promise<Asset | null>;
}

const RELATIVE_TOLERANCE = 1e-9;

const field = (name: string, message: string) =>
  new AppError('validation_failed', `Invalid request: check ${name}`, { fields: [{ field: name, message }] });

/** The same 404 for unknown, draft and paused keys: a key's existence is not revealed. */
const notLive = () => new AppError('not_found', 'No live widget has this key');

function close(a: number, b: number): boolean {
  return a === b || Math.abs(a - b) <= RELATIVE_TOLERANCE * Math.max(Math.abs(a), Math.abs(b));
}

/** Where the client's result and the server's recomputation differ; null when they agree. */
export function compareResults(
  client: EmbedRunBody['result'],
  server: CalculationResult,
): Record<string, unknown> | null {
  const problems: Record<string, unknown> = {};
  if (client.version !== server.version)
    problems.version = { client: client.version, server: server.version };
  if (client.inputHash !== server.inputHash)
    problems.inputHash = { client: client.inputHash, server: server.inputHash };
  const serverCodes = server.warnings.map((w) => w.code);
  if (client.warnings.join(',') !== serverCodes.join(','))
    problems.warnings = { client: client.warnings, server: serverCodes };
  const outputs: Record<string, unknown> = {};
  for (const k of new Set([...Object.keys(client.outputs), ...Object.keys(server.outputs)])) {
    const c = client.outputs[k];
    const s = server.outputs[k];
    const same =
      c === undefined || s === undefined ? false : c === null || s === null ? c === s : close(c, s);
    if (!same) outputs[k] = { client: c ?? null, server: s ?? null };
  }
  if (Object.keys(outputs).length) problems.outputs = outputs;
  return Object.keys(problems).length ? problems : null;
}

export function bodyHash(body: EmbedRunBody): string {
  return createHash('sha256')
    .update(canonicalJson(body as unknown as JsonValue))
    .digest('hex');
}

export function createEmbedService(deps: {
  sequelize: Sequelize;
  mailer: Mailer;
  logger: Logger;
  publicUrl: string;
  sheets: SheetService;
}): EmbedService {
  const { sequelize, mailer, logger, publicUrl, sheets } = deps;

  async function liveWidget(publicKey: string, origin: string | undefined): Promise<Widget> {
    const w = await Widget.findOne({ where: { publicKey } });
    if (!w || w.status !== 'live') throw notLive();
    if (!origin || !w.allowedOrigins.includes(origin.toLowerCase())) {
      throw new AppError('forbidden', 'This site is not allowed to embed this widget', {
        origin: origin ?? null,
      });
    }
    return w;
  }

  async function recompute(w: Widget, body: EmbedRunBody): Promise<CalculationResult> {
    const calc = getCalculator(w.calculatorId);
    if (!calc) throw new AppError('internal', `widget ${w.id} names a calculator this server lacks`);
    // A locked or hidden input is the firm's choice: a visitor's report may not change it.
    for (const [id, s] of Object.entries(w.settings.inputs)) {
      if (s.mode === 'editable' || s.default === undefined) continue;
      const sent = body.inputs[id];
      if (sent !== undefined && sent !== s.default)
        throw field(`body.inputs.${id}`, 'This input is fixed by the widget');
    }
    try {
      return calculate(w.calculatorId, body.inputs);
    } catch (e) {
      if (!(e instanceof CalcInputError)) throw e;
      const fields = e.issues.map((i) => ({ field: `body.inputs.${i.field}`, message: i.message }));
      throw new AppError(
        'validation_failed',
        `Invalid request: check ${fields.map((f) => f.field).join(', ')}`,
        { fields },
      );
    }
  }

  async function sameOrConflict(
    id: string,
    hash: string,
  ): Promise<{ id: string; agreed: boolean; duplicate: true }> {
    const existing = await Run.findByPk(id, { attributes: ['id', 'bodyHash', 'agreed'] });
    if (!existing) throw new AppError('internal', 'run vanished after a duplicate key');
    if (existing.bodyHash !== hash) {
      throw new AppError('conflict', 'This run id was already reported with different content', {
        fields: [{ field: 'body.id', message: 'Already used for another run' }],
      });
    }
    return { id, agreed: existing.agreed, duplicate: true };
  }

  async function recipientsFor(w: Widget): Promise<string[]> {
    if (w.settings.leadForm.notify.length) return w.settings.leadForm.notify;
    // Nobody chosen: the firm's owners and admins hear of it rather than nobody.
    const members = await Membership.findAll({
      where: { organizationId: w.organizationId, role: { [Op.in]: ['owner', 'admin'] } },
      include: [{ model: User, as: 'user', required: true, attributes: ['email'] }],
    });
    return members.map((m) => m.user?.email).filter((e): e is string => Boolean(e));
  }

  return {
    async widgetFor(publicKey, origin) {
      const w = await liveWidget(publicKey, origin);
      let logoUrl: string | null = null;
      if (w.settings.look.logoAssetId !== null) {
        const a = await Asset.findOne({
          where: { id: w.settings.look.logoAssetId, organizationId: w.organizationId },
          attributes: ['id', 'sha256'],
        });
        logoUrl = a ? assetUrl(publicUrl, a) : null;
      }
      const { inputs, units, look, cautions, leadForm } = w.settings;
      return {
        publicKey: w.publicKey,
        name: w.name,
        calculatorId: w.calculatorId,
        release: w.release,
        settings: {
          inputs,
          units,
          look: { colors: look.colors, font: look.font, corner: look.corner, logoUrl },
          cautions,
          leadForm: { enabled: leadForm.enabled, fields: leadForm.fields, consentText: leadForm.consentText },
        },
      };
    },

    async recordRun(body, origin) {
      const w = await liveWidget(body.publicKey, origin);
      const hash = bodyHash(body);
      const known = await Run.findByPk(body.id, { attributes: ['id'] });
      if (known) return sameOrConflict(body.id, hash);
      const server = await recompute(w, body);
      const mismatch = compareResults(body.result, server);
      const row: RunRow = {
        id: body.id,
        organizationId: w.organizationId,
        widgetId: w.id,
        calculatorId: w.calculatorId,
        origin: (origin as string).toLowerCase(),
        pageUrl: body.pageUrl ?? null,
        release: w.release,
        calcVersion: body.result.version,
        unitSystem: body.unitSystem,
        inputs: body.inputs,
        clientResult: body.result,
        serverResult: server as unknown as Record<string, unknown>,
        warningCodes: server.warnings.map((x) => x.code),
        hasWarning: server.warnings.length > 0,
        agreed: mismatch === null,
        mismatch,
        inputHash: server.inputHash,
        bodyHash: hash,
        // Chosen here, not by the database, so the rollups count the run on the day it is stored with.
        createdAt: new Date(),
      };
      try {
        // Answered only once the run and its rollup counts have committed: an acknowledged run is stored.
        await retryOnDeadlock(() =>
          sequelize.transaction((transaction) => storeRuns(sequelize, [row], transaction)),
        );
      } catch (e) {
        if (e instanceof UniqueConstraintError) return sameOrConflict(body.id, hash);
        throw e;
      }
      return { id: body.id, agreed: mismatch === null, duplicate: false };
    },

    async recordLead(body, origin) {
      const w = await liveWidget(body.publicKey, origin);
      const form = w.settings.leadForm;
      if (!form.enabled) throw new AppError('forbidden', 'This widget does not take requests');
      const issues: { field: string; message: string }[] = [];
      for (const id of leadFieldIds) {
        const mode = form.fields[id];
        const value = body.fields[id];
        if (mode === 'required' && value === undefined)
          issues.push({ field: `body.fields.${id}`, message: 'Required' });
        if (mode === 'off' && value !== undefined)
          issues.push({ field: `body.fields.${id}`, message: 'This widget does not ask for it' });
      }
      if (body.sendCopy && !body.fields.email)
        issues.push({ field: 'body.fields.email', message: 'Needed to send you a copy' });
      if (issues.length) {
        throw new AppError(
          'validation_failed',
          `Invalid request: check ${issues.map((i) => i.field).join(', ')}`,
          { fields: issues },
        );
      }
      const run = await Run.findOne({ where: { id: body.runId, widgetId: w.id } });
      if (!run) throw field('body.runId', 'No run of this widget has this id');

      const lead = await sequelize.transaction(async (transaction) => {
        // One request per run: lock the run's row so two submissions cannot both pass the check, and
        // so a purge cannot delete it before the lead and its rollup count are stored.
        const locked = await sequelize.query<RollupColumnsRow>(
          `SELECT ${ROLLUP_COLUMNS} FROM runs r WHERE r.id = ? FOR UPDATE`,
          {
            replacements: [run.id],
            type: QueryTypes.SELECT,
            transaction,
          },
        );
        if (!locked[0]) throw field('body.runId', 'No run of this widget has this id');
        if (await Lead.count({ where: { runId: run.id }, transaction })) {
          throw new AppError('conflict', 'A request was already sent for this result', {
            fields: [{ field: 'body.runId', message: 'Already has a request' }],
          });
        }
        const f = body.fields as Partial<Record<LeadFieldId, string>>;
        const created = await Lead.create(
          {
            organizationId: w.organizationId,
            widgetId: w.id,
            runId: run.id,
            name: f.name ?? null,
            email: f.email ?? null,
            company: f.company ?? null,
            phone: f.phone ?? null,
            message: f.message ?? null,
            siteAddress: f.siteAddress ?? null,
            consentText: form.consentText,
            consentAt: new Date(),
            origin: (origin as string).toLowerCase(),
            sendCopy: body.sendCopy,
          },
          { transaction },
        );
        await countLeads(sequelize, [rollupRunOf(locked[0])], 1, transaction);
        return created;
      });

      // The lead is stored; mail failures are logged, never lose it.
      const org = await Organization.findByPk(w.organizationId, { attributes: ['id', 'name'] });
      const calc = getCalculator(w.calculatorId);
      const result = run.serverResult as unknown as CalculationResult | null;
      const link = `${publicUrl.replace(/\/$/, '')}/orgs/${w.organizationId}/leads/${lead.id}`;
      for (const to of await recipientsFor(w)) {
        await sendSafely(
          mailer,
          logger,
          leadNotificationMail({
            to,
            orgName: org?.name ?? '',
            widgetName: w.name,
            lead,
            link,
            calc,
            result,
            system: run.unitSystem,
          }),
          'lead notification',
        );
      }
      if (body.sendCopy && lead.email && calc && result) {
        // The copy carries the calculation sheet; a sheet that cannot be made never stops the mail.
        const sheet = await sheets.forRun(run, w).catch((err: unknown) => {
          logger.error({ err, runId: run.id }, 'calculation sheet for the e-mailed copy could not be made');
          return null;
        });
        const mail = resultCopyMail({
          to: lead.email,
          orgName: org?.name ?? '',
          widgetName: w.name,
          calc,
          result,
          system: run.unitSystem,
          firmCautions: w.settings.cautions,
        });
        if (sheet)
          mail.attachments = [
            { filename: sheet.filename, content: sheet.pdf, contentType: 'application/pdf' },
          ];
        await sendSafely(mailer, logger, mail, 'result copy');
      }
      return { id: lead.id };
    },

    async originKnown(origin) {
      const rows = await sequelize.query<{ n: number }>(
        "SELECT COUNT(*) AS n FROM widgets WHERE status = 'live' AND JSON_CONTAINS(allowed_origins, JSON_QUOTE(?))",
        { replacements: [origin.toLowerCase()], type: QueryTypes.SELECT },
      );
      return Number(rows[0]?.n ?? 0) > 0;
    },

    asset: (id) => Asset.findByPk(id),
  };
}

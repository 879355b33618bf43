import { Op, QueryTypes, type Sequelize } from 'sequelize';
import type { Logger } from 'pino';
import { getCalculator, type CalculationResult } from '@wickstone/calc-core';
import type {
  EmbedLeadBody,
  EmbedRunBody,
  EmbedWidget,
  LeadFieldId,
  WidgetSettings,
} from '@wickstone/contracts';
import { leadFieldIds } from '@wickstone/contracts';
import { Asset, Lead, Membership, Organization, Run, User, Widget } from '../db/models/index.js';
import { AppError } from '../errors.js';
import type { Counters } from '../http/counters.js';
import type { AllowanceFacts } from '../billing/allowance.js';
import { sendSafely, type Mailer } from '../mail/mailer.js';
import { assetUrl } from '../widgets/service.js';
import { leadNotificationMail, resultCopyMail, type FirmBrand } from './mail.js';
import { checkWidget, createRunIngest, type RunIngest, type RunReceipt } from './ingest.js';
import type { SheetService } from '../sheets/service.js';
import { createReplacedKeys } from './keys.js';
import { wholeResult, type EngineOf } from '../runs/working.js';
import { countLeads, ROLLUP_COLUMNS, rollupRunOf, type RollupColumnsRow } from '../usage/rollups.js';

export interface EmbedService {
  widgetFor(publicKey: string, origin: string | undefined): Promise<EmbedWidget>;
  /** Answered once the run has committed with its batch (see ingest.ts). */
  recordRun(body: EmbedRunBody, origin: string | undefined): Promise<RunReceipt>;
  recordLead(body: EmbedLeadBody, origin: string | undefined): Promise<{ id: number }>;
  /** Whether any live widget lets this origin embed it (for CORS preflight). */
  originKnown(origin: string): Promise<boolean>;
  asset(id: number): Promise<Asset | null>;
  /** `use(publicKey)`, or with the widget's new key when the page names a replaced key still served. */
  withKey<T>(publicKey: string, use: (key: string) => Promise<T>): Promise<T>;
}

const field = (name: string, message: string) =>
  new AppError('validation_failed', `Invalid request: check ${name}`, { fields: [{ field: name, message }] });

export function createEmbedService(deps: {
  sequelize: Sequelize;
  mailer: Mailer;
  logger: Logger;
  publicUrl: string;
  /** Called with runs once they are committed (the plan's run allowance); its failure never fails the report. */
  afterRunsStored?: (
    runs: { id: string; organizationId: number; createdAt: Date }[],
    known?: AllowanceFacts,
  ) => Promise<void>;
  counters: Counters;
  /** Result copies mailed per recipient address per day and per widget per hour. */
  copyLimits: { perRecipientPerDay: number; perWidgetPerHour: number };
  /** The group-commit ingest of run reports; one per process. */
  ingest?: RunIngest;
  sheets: SheetService;
  /** Release engines: the e-mailed working is made again with the engine of the run's release. */
  engineOf?: EngineOf;
}): EmbedService {
  const { sequelize, mailer, logger, publicUrl, counters, copyLimits, sheets } = deps;
  const afterStored = deps.afterRunsStored;
  const replacedKeys = createReplacedKeys(sequelize);
  const ingest =
    deps.ingest ??
    createRunIngest(sequelize, {
      ...(afterStored
        ? {
            afterStored: (runs, known) =>
              afterStored(runs, known).catch((err: unknown) =>
                logger.error({ err }, 'run allowance hook failed'),
              ),
          }
        : {}),
    });

  /**
   * Whether one more result copy may go to this address from this widget. A copy goes to whatever
   * address a visitor typed, under the firm's name, so it is limited per recipient (a stranger's
   * mailbox cannot be flooded) and per widget (one widget cannot be used to mail many addresses).
   */
  async function copyAllowed(to: string, widgetId: number): Promise<boolean> {
    const recipient = await counters.hit(`copy-to:${to.toLowerCase()}`, 24 * 3_600_000);
    if (recipient.hits > copyLimits.perRecipientPerDay) return false;
    const widget = await counters.hit(`copy-widget:${widgetId}`, 3_600_000);
    return widget.hits <= copyLimits.perWidgetPerHour;
  }

  async function liveWidget(publicKey: string, origin: string | undefined): Promise<Widget> {
    return replacedKeys.withKey(publicKey, async (key) =>
      checkWidget(await Widget.findOne({ where: { publicKey: key } }), origin),
    );
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

  /** The widget's logo as a URL anyone may load (the embed API's asset route), or null. */
  async function logoUrlOf(w: Widget): Promise<string | null> {
    if (w.settings.look.logoAssetId === null) return null;
    const a = await Asset.findOne({
      where: { id: w.settings.look.logoAssetId, organizationId: w.organizationId },
      attributes: ['id', 'sha256'],
    });
    return a ? assetUrl(publicUrl, a) : null;
  }

  /** The firm as its e-mails show it: the widget's colours and logo under the organisation's name. */
  async function brandOf(w: Widget, name: string): Promise<FirmBrand> {
    const { primary, primaryText } = w.settings.look.colors;
    return { name, colors: { primary, primaryText }, logoUrl: await logoUrlOf(w) };
  }

  return {
    async widgetFor(publicKey, origin) {
      const w = await liveWidget(publicKey, origin);
      const logoUrl = await logoUrlOf(w);
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
          // Widgets saved before sheets existed have no setting: sheets are on by default.
          sheet: { enabled: (w.settings as Partial<typeof w.settings>).sheet?.enabled ?? true },
          // Settings stored before the result settings existed have none: secondary outputs folded.
          result: (w.settings as Partial<WidgetSettings>).result ?? { secondary: 'folded' },
        },
      };
    },

    recordRun: (body, origin) =>
      replacedKeys.withKey(body.publicKey, (publicKey) => ingest.submit({ ...body, publicKey }, origin)),

    withKey: (publicKey, use) => replacedKeys.withKey(publicKey, use),

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
      const brand = await brandOf(w, org?.name ?? '');
      const notify = await recipientsFor(w);
      const calc = getCalculator(w.calculatorId);
      // The lead is stored whatever happens here: a working that cannot be made again sends the
      // notification without the result, never an error to the visitor.
      let result: CalculationResult | null = null;
      try {
        result = wholeResult(run, deps.engineOf);
      } catch (err) {
        logger.error({ err, runId: run.id }, 'the working of a run could not be made again for its mail');
      }
      const link = `${publicUrl.replace(/\/$/, '')}/orgs/${w.organizationId}/leads/${lead.id}`;
      for (const to of notify) {
        await sendSafely(
          mailer,
          logger,
          leadNotificationMail({
            to,
            brand,
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
        if (await copyAllowed(lead.email, w.id)) {
          // The copy carries the calculation sheet; a sheet that cannot be made never stops the mail.
          const sheet = await sheets.forRun(run, w).catch((err: unknown) => {
            logger.error({ err, runId: run.id }, 'calculation sheet for the e-mailed copy could not be made');
            return null;
          });
          const mail = resultCopyMail({
            to: lead.email,
            visitorName: lead.name,
            brand,
            replyTo: notify,
            widgetName: w.name,
            origin: lead.origin,
            calc,
            result,
            system: run.unitSystem,
            firmCautions: w.settings.cautions,
            hiddenInputs: Object.entries(w.settings.inputs)
              .filter(([, i]) => i.mode === 'hidden')
              .map(([id]) => id),
          });
          if (sheet)
            mail.attachments = [
              { filename: sheet.filename, content: sheet.pdf, contentType: 'application/pdf' },
            ];
          await sendSafely(mailer, logger, mail, 'result copy');
        } else {
          logger.warn({ widgetId: w.id, leadId: lead.id }, 'result copy not sent: copy limit reached');
        }
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

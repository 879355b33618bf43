import { embedCsp, embedVariants, reservedHeight } from './snippet.js';
import { randomBytes } from 'node:crypto';
import { Op, QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import semver from 'semver';
import {
  CalcInputError,
  getCalculator,
  resolveInputs,
  type CalculatorDefinition,
} from '@wickstone/calc-core';
import {
  defaultWidgetSettings,
  isReferenceKey,
  keyValidUntil,
  legacyKeyFrom,
  MAX_KEY_OVERLAP_DAYS,
  REFERENCE_KEYS_SINCE,
  referenceKeyFrom,
  type Widget as WidgetDto,
  type WidgetRevision as WidgetRevisionDto,
  type WidgetSettings,
  type WidgetStatus,
  type createWidgetBodySchema,
  type updateWidgetBodySchema,
} from '@wickstone/contracts';
import type { z } from 'zod';
import { Asset, User, Widget, WidgetRevision } from '../db/models/index.js';
import { AppError, fieldError } from '../errors.js';
import type { AuditTrail } from '../audit/service.js';
import type { ReleaseService } from '../releases/service.js';
import { diff } from './diff.js';
import { assertLiveRoom, assertWidgetRoom } from '../billing/limits.js';

type CreateBody = z.output<typeof createWidgetBodySchema>;
type UpdateBody = z.output<typeof updateWidgetBodySchema>;

export interface WidgetService {
  list(orgId: number, page: number, pageSize: number): Promise<{ items: WidgetDto[]; total: number }>;
  get(orgId: number, widgetId: number): Promise<WidgetDto>;
  /** `trail` records the change in the audit log, in the same transaction. */
  create(orgId: number, actorId: number, body: CreateBody, trail?: AuditTrail): Promise<WidgetDto>;
  update(
    orgId: number,
    widgetId: number,
    actorId: number,
    body: UpdateBody,
    trail?: AuditTrail,
  ): Promise<WidgetDto>;
  revisions(
    orgId: number,
    widgetId: number,
    page: number,
    pageSize: number,
  ): Promise<{ items: WidgetRevisionDto[]; total: number }>;
  /**
   * Pin the widget to an exact release or a minor line (`~0.2`), resolved now; its snippet and SRI
   * follow. A 400 naming `body.pin` when no release the server has fits, nothing changed.
   */
  setPin(
    orgId: number,
    widgetId: number,
    actorId: number,
    pin: string,
    trail?: AuditTrail,
  ): Promise<WidgetDto>;
  /**
   * Move widgets pinned to a minor line to its newest published release (after a release is
   * published and the server restarted); returns how many moved.
   */
  followPins(): Promise<number>;
  /**
   * Puts back the name, sites and settings the widget had after revision `revisionId`, as a new
   * save (so it is itself in the history and the audit log, which names the revision). The status
   * stays as it is now: restoring settings never puts a widget on or off a site by surprise.
   */
  restore(
    orgId: number,
    widgetId: number,
    revisionId: number,
    actorId: number,
    trail?: AuditTrail,
  ): Promise<WidgetDto>;
  /**
   * Issue the widget a new key; the old one is served until `oldKeyValidUntil` (400 naming
   * `body.oldKeyValidUntil` when past or more than MAX_KEY_OVERLAP_DAYS ahead; 409 while an earlier
   * replaced key is still served). Audited.
   */
  rotateKey(
    orgId: number,
    widgetId: number,
    actorId: number,
    oldKeyValidUntil: string,
    trail?: AuditTrail,
  ): Promise<WidgetDto>;
  /**
   * Stops serving the key the last rotation replaced, now (a leaked key, or every page already
   * updated): from this moment it is answered 410 as replaced. A 409 when no replaced key is served.
   */
  endKeyOverlap(orgId: number, widgetId: number, actorId: number, trail?: AuditTrail): Promise<WidgetDto>;
  toDto(widget: Widget): WidgetDto;
}

/** Whether a release's loader reads reference keys (0.1.0 and 0.2.0, published, read only `wk_` keys). */
export function readsReferenceKeys(release: string): boolean {
  const v = semver.valid(release);
  return v !== null && semver.gte(v, REFERENCE_KEYS_SINCE);
}

/**
 * A new key for a widget on `release`: a reference key when its loader reads them, else an
 * older-style key, so a widget pinned to a published older release keeps a key its loader accepts.
 */
function newPublicKey(release: string): string {
  return readsReferenceKeys(release) ? referenceKeyFrom(randomBytes(16)) : legacyKeyFrom(randomBytes(20));
}

/** Whether a widget's replaced key is still served (its overlap has not ended). */
const previousServed = (w: Widget): boolean =>
  w.previousPublicKey !== null &&
  w.previousKeyValidUntil !== null &&
  w.previousKeyValidUntil.getTime() > Date.now();

const day = (d: Date) => d.toISOString().slice(0, 10);

export function assetUrl(publicUrl: string, asset: { id: number; sha256: string }): string {
  return `${publicUrl.replace(/\/$/, '')}/api/v1/embed/assets/${asset.id}/${asset.sha256.slice(0, 16)}`;
}

/**
 * A firm's list of offered options: only for a choice input, each one of its options, and the
 * default (the firm's or the calculator's) among them, so the form never starts on a value it
 * does not offer.
 */
function checkOptions(
  calc: CalculatorDefinition,
  id: string,
  s: WidgetSettings['inputs'][string],
  at: string,
  fields: { field: string; message: string }[],
): void {
  const input = calc.inputs.find((i) => i.id === id);
  const offered = s.options ?? [];
  if (input?.kind !== 'choice') {
    fields.push({ field: `${at}.options`, message: `${input?.label ?? id} is not a choice` });
    return;
  }
  offered.forEach((value, n) => {
    if (!input.options.some((o) => o.value === value))
      fields.push({ field: `${at}.options.${n}`, message: `${input.label} has no option "${value}"` });
  });
  const start = typeof s.default === 'string' ? s.default : input.default;
  if (!offered.includes(start))
    fields.push({
      field: `${at}.options`,
      message: `The default "${start}" must be one of the options offered`,
    });
}

/**
 * Check a widget's input settings against its calculator: every key is one of its inputs, and
 * every default is a value the calculator accepts (calc-core decides, naming each bad field).
 */
function checkInputSettings(calc: CalculatorDefinition, settings: WidgetSettings, where: string): void {
  const known = new Set(calc.inputs.map((i) => i.id));
  const fields: { field: string; message: string }[] = [];
  const defaults: Record<string, unknown> = {};
  for (const [id, s] of Object.entries(settings.inputs)) {
    const input = calc.inputs.find((i) => i.id === id);
    if (!known.has(id))
      fields.push({ field: `${where}.inputs.${id}`, message: `${calc.title} has no input "${id}"` });
    else if (input?.kind === 'table' && s.mode !== 'editable')
      // Readings are the visitor's own measurements: a firm may offer starting rows, never fix them.
      fields.push({
        field: `${where}.inputs.${id}.mode`,
        message: `${input.label} is the visitor's own readings: it cannot be locked or hidden`,
      });
    else if (s.default !== undefined) defaults[id] = s.default;
    if (s.options !== undefined && known.has(id)) checkOptions(calc, id, s, `${where}.inputs.${id}`, fields);
  }
  if (fields.length === 0) {
    try {
      resolveInputs(calc, defaults);
    } catch (e) {
      if (!(e instanceof CalcInputError)) throw e;
      for (const issue of e.issues)
        fields.push({ field: `${where}.inputs.${issue.field}.default`, message: issue.message });
    }
  }
  if (fields.length) {
    throw new AppError(
      'validation_failed',
      `Invalid request: check ${fields.map((f) => f.field).join(', ')}`,
      { fields },
    );
  }
}

/**
 * Move widgets pinned to a minor line (`~0.2`) to its newest published release: run when the
 * server starts, since releases only arrive with a deployment. Returns how many moved.
 */
export async function followReleasePins(releases: ReleaseService): Promise<number> {
  let moved = 0;
  const pinned = await Widget.findAll({ where: { releasePin: { [Op.startsWith]: '~' } } });
  for (const w of pinned) {
    const version = releases.resolve(w.releasePin as string);
    if (!version || version === w.release || !releases.script(version, w.calculatorId)) continue;
    await w.update({ release: version });
    moved += 1;
  }
  return moved;
}

export function createWidgetService(deps: {
  sequelize: Sequelize;
  releases: ReleaseService;
  publicUrl: string;
  widgetVersion: string;
}): WidgetService {
  const { sequelize, releases, publicUrl } = deps;

  async function logoUrl(orgId: number, assetId: number | null): Promise<string | null> {
    if (assetId === null) return null;
    const asset = await Asset.findOne({
      where: { id: assetId, organizationId: orgId },
      attributes: ['id', 'sha256'],
    });
    return asset ? assetUrl(publicUrl, asset) : null;
  }

  async function checkLogo(orgId: number, settings: WidgetSettings, where: string): Promise<void> {
    const id = settings.look.logoAssetId;
    if (id === null) return;
    const found = await Asset.count({ where: { id, organizationId: orgId } });
    if (!found) throw fieldError(`${where}.look.logoAssetId`, 'No such image in this organisation');
  }

  function calculatorOf(id: string, field: string): CalculatorDefinition {
    const calc = getCalculator(id);
    if (!calc) throw fieldError(field, `No calculator "${id}"`);
    return calc;
  }

  function embed(w: Widget): WidgetDto['embed'] {
    const script = releases.script(w.release, w.calculatorId);
    if (!script)
      return {
        scriptUrl: '',
        integrity: '',
        snippet: '',
        variants: { plain: '', async: '', nonce: '', heldCss: '' },
        csp: [],
      };
    const calc = getCalculator(w.calculatorId);
    const variants = embedVariants({
      url: script.url,
      integrity: script.integrity,
      publicKey: w.publicKey,
      calculatorId: w.calculatorId,
      height: calc ? reservedHeight(calc, w.settings) : 0,
    });
    return {
      scriptUrl: script.url,
      integrity: script.integrity,
      snippet: variants.async,
      variants,
      csp: embedCsp(new URL(script.url).origin),
    };
  }

  function toDto(w: Widget, logo: string | null = null): WidgetDto {
    return {
      id: w.id,
      publicKey: w.publicKey,
      name: w.name,
      calculatorId: w.calculatorId,
      status: w.status,
      allowedOrigins: w.allowedOrigins,
      settings: w.settings,
      release: w.release,
      releasePin: w.releasePin ?? null,
      logoUrl: logo,
      embed: embed(w),
      previousKey:
        w.previousPublicKey && w.keyReplacedAt && w.previousKeyValidUntil
          ? {
              publicKey: w.previousPublicKey,
              replacedAt: w.keyReplacedAt.toISOString(),
              validUntil: w.previousKeyValidUntil.toISOString(),
              served: w.previousKeyValidUntil.getTime() > Date.now(),
            }
          : null,
      nextKeyKind: readsReferenceKeys(w.release) ? 'reference' : 'older',
      createdAt: w.createdAt.toISOString(),
      updatedAt: w.updatedAt.toISOString(),
    };
  }

  async function dto(w: Widget): Promise<WidgetDto> {
    return toDto(w, await logoUrl(w.organizationId, w.settings.look.logoAssetId));
  }

  async function find(orgId: number, widgetId: number): Promise<Widget> {
    const w = await Widget.findOne({ where: { id: widgetId, organizationId: orgId } });
    if (!w) throw new AppError('not_found', 'Widget not found');
    return w;
  }

  const snapshot = (w: {
    name: string;
    status: WidgetStatus;
    allowedOrigins: string[];
    settings: WidgetSettings;
    release: string;
  }) => ({
    name: w.name,
    status: w.status,
    allowedOrigins: w.allowedOrigins,
    settings: w.settings,
    release: w.release,
  });

  /** The widget, locked for the rest of the transaction; a 404 when the organisation has none such. */
  async function findForUpdate(orgId: number, widgetId: number, transaction: Transaction): Promise<Widget> {
    const w = await Widget.findOne({
      where: { id: widgetId, organizationId: orgId },
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    if (!w) throw new AppError('not_found', 'Widget not found');
    return w;
  }

  /** The release a pin stands for, or a 400 naming `body.pin`. */
  function resolvePin(pin: string, calculatorId: string): string {
    const exact = semver.valid(pin);
    const version = exact ? (releases.get(pin) ? pin : null) : releases.resolve(pin);
    if (!version)
      throw fieldError(
        'body.pin',
        exact ? `No release ${pin} on this server` : `No published release in the line ${pin}`,
      );
    if (!releases.script(version, calculatorId))
      throw fieldError('body.pin', `Release ${version} has no ${calculatorId} calculator`);
    return version;
  }

  const service: WidgetService = {
    toDto: (w) => toDto(w),

    async setPin(orgId, widgetId, actorId, pin, trail) {
      return sequelize.transaction(async (transaction) => {
        const w = await findForUpdate(orgId, widgetId, transaction);
        const release = resolvePin(pin, w.calculatorId);
        const served = [w.publicKey, ...(previousServed(w) ? [w.previousPublicKey as string] : [])];
        const unread = served.find((k) => isReferenceKey(k));
        if (unread && !readsReferenceKeys(release))
          throw fieldError(
            'body.pin',
            `Release ${release}'s loader reads only older wk_ keys, and this widget's key ${unread} is a reference key: pin ${REFERENCE_KEYS_SINCE} or later`,
          );
        const before = { release: w.release, releasePin: w.releasePin ?? null };
        const after = { release, releasePin: pin };
        const changes = diff(before, after);
        if (changes.length === 0) return dto(w);
        await w.update(after, { transaction });
        await WidgetRevision.create(
          {
            widgetId: w.id,
            organizationId: orgId,
            authorId: actorId,
            changes,
            snapshot: snapshot(w),
          },
          { transaction },
        );
        await trail?.(
          {
            type: 'widget.release_pinned',
            subject: w.name,
            details: { widgetId: w.id, pin, release: { from: before.release, to: release } },
          },
          transaction,
        );
        return dto(w);
      });
    },

    followPins: () => followReleasePins(releases),

    async rotateKey(orgId, widgetId, actorId, oldKeyValidUntil, trail) {
      const until = keyValidUntil(oldKeyValidUntil);
      const now = Date.now();
      if (until.getTime() <= now)
        throw fieldError(
          'body.oldKeyValidUntil',
          'Choose a moment after now: the old key must be served a while',
        );
      if (until.getTime() > now + MAX_KEY_OVERLAP_DAYS * 86_400_000)
        throw fieldError(
          'body.oldKeyValidUntil',
          `At most ${MAX_KEY_OVERLAP_DAYS} days ahead: the old key is served for at most ${MAX_KEY_OVERLAP_DAYS} days`,
        );
      return sequelize.transaction(async (transaction) => {
        const w = await findForUpdate(orgId, widgetId, transaction);
        if (previousServed(w))
          throw new AppError(
            'conflict',
            `The key replaced on ${day(w.keyReplacedAt as Date)} is still served until ${(w.previousKeyValidUntil as Date).toISOString()}: rotate again after that`,
            { previousKeyValidUntil: (w.previousKeyValidUntil as Date).toISOString() },
          );
        const oldKey = w.publicKey;
        const newKey = newPublicKey(w.release);
        await w.update(
          {
            publicKey: newKey,
            previousPublicKey: oldKey,
            keyReplacedAt: new Date(now),
            previousKeyValidUntil: until,
          },
          { transaction },
        );
        await trail?.(
          {
            type: 'widget.key_rotated',
            subject: w.name,
            details: { widgetId: w.id, oldKey, newKey, oldKeyValidUntil: until.toISOString() },
          },
          transaction,
        );
        return dto(w);
      });
    },

    async endKeyOverlap(orgId, widgetId, _actorId, trail) {
      return sequelize.transaction(async (transaction) => {
        const w = await findForUpdate(orgId, widgetId, transaction);
        if (!previousServed(w))
          throw new AppError(
            'conflict',
            'No replaced key of this widget is being served: there is nothing to stop',
          );
        const plannedUntil = (w.previousKeyValidUntil as Date).toISOString();
        // The database's clock, as the embed API's check of a replaced key uses.
        const [row] = await sequelize.query<{ now: Date }>('SELECT NOW(3) AS now', {
          type: QueryTypes.SELECT,
          transaction,
        });
        const now = new Date(row!.now);
        await w.update({ previousKeyValidUntil: now }, { transaction });
        await trail?.(
          {
            type: 'widget.key_overlap_ended',
            subject: w.name,
            details: {
              widgetId: w.id,
              oldKey: w.previousPublicKey,
              plannedUntil,
              endedAt: now.toISOString(),
            },
          },
          transaction,
        );
        return dto(w);
      });
    },

    async list(orgId, page, pageSize) {
      const { rows, count } = await Widget.findAndCountAll({
        where: { organizationId: orgId },
        order: [
          ['updatedAt', 'DESC'],
          ['id', 'DESC'],
        ],
        limit: pageSize,
        offset: (page - 1) * pageSize,
      });
      return { items: await Promise.all(rows.map(dto)), total: count };
    },

    async get(orgId, widgetId) {
      return dto(await find(orgId, widgetId));
    },

    async create(orgId, actorId, body, trail) {
      const calc = calculatorOf(body.calculatorId, 'body.calculatorId');
      const settings = body.settings ?? defaultWidgetSettings();
      checkInputSettings(calc, settings, 'body.settings');
      await checkLogo(orgId, settings, 'body.settings');
      const release = releases.latest()?.version ?? deps.widgetVersion;
      const publicKey = newPublicKey(release);
      const w = await sequelize.transaction(async (transaction) => {
        await assertWidgetRoom(orgId, transaction);
        const created = await Widget.create(
          {
            organizationId: orgId,
            publicKey,
            name: body.name,
            calculatorId: calc.id,
            status: 'draft',
            allowedOrigins: body.allowedOrigins ?? [],
            settings,
            release,
          },
          { transaction },
        );
        const snap = snapshot({ ...created.get(), status: 'draft' });
        await WidgetRevision.create(
          {
            widgetId: created.id,
            organizationId: orgId,
            authorId: actorId,
            changes: diff({}, snap),
            snapshot: snap,
          },
          { transaction },
        );
        await trail?.(
          {
            type: 'widget.created',
            subject: created.name,
            details: { widgetId: created.id, calculatorId: calc.id },
          },
          transaction,
        );
        return created;
      });
      return dto(w);
    },

    async update(orgId, widgetId, actorId, body, trail) {
      return sequelize.transaction(async (transaction) => {
        const w = await findForUpdate(orgId, widgetId, transaction);
        const calc = calculatorOf(w.calculatorId, 'calculatorId');
        if (body.settings) {
          checkInputSettings(calc, body.settings, 'body.settings');
          await checkLogo(orgId, body.settings, 'body.settings');
        }
        const before = snapshot(w);
        const after = {
          ...before,
          ...(body.name !== undefined ? { name: body.name } : {}),
          ...(body.status !== undefined ? { status: body.status } : {}),
          ...(body.allowedOrigins !== undefined ? { allowedOrigins: [...new Set(body.allowedOrigins)] } : {}),
          ...(body.settings !== undefined ? { settings: body.settings } : {}),
        };
        if (after.status === 'live' && after.allowedOrigins.length === 0) {
          throw fieldError(
            'body.allowedOrigins',
            'A widget in service needs at least one site allowed to embed it',
          );
        }
        if (after.status === 'live' && before.status !== 'live')
          await assertLiveRoom(orgId, w.id, transaction);
        const changes = diff(before, after);
        if (changes.length === 0) return dto(w);
        await w.update(after, { transaction });
        await WidgetRevision.create(
          { widgetId: w.id, organizationId: orgId, authorId: actorId, changes, snapshot: after },
          { transaction },
        );
        await trail?.(
          {
            type: 'widget.updated',
            subject: after.name,
            details: {
              widgetId: w.id,
              changed: changes.map((c) => c.path),
              ...(before.status !== after.status
                ? { status: { from: before.status, to: after.status } }
                : {}),
            },
          },
          transaction,
        );
        return dto(w);
      });
    },

    async restore(orgId, widgetId, revisionId, actorId, trail) {
      await find(orgId, widgetId);
      const revision = await WidgetRevision.findOne({
        where: { id: revisionId, widgetId, organizationId: orgId },
      });
      if (!revision) throw new AppError('not_found', 'Revision not found');
      const snap = revision.snapshot as Partial<ReturnType<typeof snapshot>>;
      return service.update(
        orgId,
        widgetId,
        actorId,
        {
          ...(snap.name !== undefined ? { name: snap.name } : {}),
          ...(snap.allowedOrigins !== undefined ? { allowedOrigins: snap.allowedOrigins } : {}),
          ...(snap.settings !== undefined ? { settings: snap.settings } : {}),
        },
        trail &&
          ((entry, transaction) =>
            trail({ ...entry, details: { ...entry.details, restoredRevision: revisionId } }, transaction)),
      );
    },

    async revisions(orgId, widgetId, page, pageSize) {
      await find(orgId, widgetId);
      const { rows, count } = await WidgetRevision.findAndCountAll({
        where: { widgetId, organizationId: orgId },
        order: [['id', 'DESC']],
        limit: pageSize,
        offset: (page - 1) * pageSize,
      });
      const authorIds = [...new Set(rows.map((r) => r.authorId).filter((x): x is number => x !== null))];
      const authors = new Map(
        (await User.findAll({ where: { id: authorIds }, attributes: ['id', 'name'] })).map((u) => [
          u.id,
          u.name,
        ]),
      );
      return {
        items: rows.map((r) => ({
          id: r.id,
          widgetId: r.widgetId,
          author:
            r.authorId !== null ? { id: r.authorId, name: authors.get(r.authorId) ?? 'former member' } : null,
          changes: r.changes,
          createdAt: r.createdAt.toISOString(),
        })),
        total: count,
      };
    },
  };
  return service;
}

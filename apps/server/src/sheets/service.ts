import {
  calculate,
  getCalculator,
  type CalculationResult,
  type CalculatorDefinition,
  tableSummary,
} from '@wickstone/calc-core';
import type { SheetProject, VerifyResponse, WidgetSettings } from '@wickstone/contracts';
import { Asset, Organization, Run, Widget } from '../db/models/index.js';
import { AppError } from '../errors.js';
import { shown } from '../embed/format.js';
import { renderSheet } from './render.js';
import type { ReleaseService } from '../releases/service.js';
import { wholeResult } from '../runs/working.js';

export interface Sheet {
  pdf: Buffer;
  filename: string;
}

export interface SheetService {
  /**
   * For the visitor: only a run of this live widget, asked for from one of its origins. With
   * `store`, a project block that says anything is kept with the run (later copies print it);
   * a block that says nothing prints the one stored.
   */
  forVisitor(p: {
    runId: string;
    publicKey: string;
    origin: string | undefined;
    project: SheetProject;
    store?: boolean;
  }): Promise<Sheet>;
  /** For the firm's analysts: any run of the organisation, with the stored block unless one is given. */
  forOrg(orgId: number, runId: string, project: SheetProject): Promise<Sheet>;
  verify(runId: string): Promise<VerifyResponse>;
  /** The sheet for a run already loaded, or null where the widget has sheets turned off. */
  forRun(run: Run, w: Widget): Promise<Sheet | null>;
}

const DEFAULT_SHEET: WidgetSettings['sheet'] = { enabled: true, paper: 'a4' };
/** One answer for unknown, erased and not-yours: a run id's existence is not revealed. */
const noRun = () =>
  new AppError(
    'not_found',
    'No run has this id here: it never existed, or it was erased under the retention policy',
  );
const RELATIVE_TOLERANCE = 1e-9;

/** Whether a project block says anything: three empty fields are no block. */
const saysSomething = (p: SheetProject): boolean => Boolean(p.project || p.preparedFor || p.note);
/** The fields that say something, so a stored block never holds empty strings. */
const filled = (p: SheetProject): SheetProject =>
  Object.fromEntries(Object.entries(p).filter(([, v]) => Boolean(v))) as SheetProject;
/** The block to print: the one given, else the one stored with the run. */
const projectFor = (run: Run, given: SheetProject): SheetProject =>
  saysSomething(given) ? filled(given) : (run.sheetProject ?? {});

const sheetSettings = (w: Widget): WidgetSettings['sheet'] =>
  // Widgets saved before sheets existed have no setting: the default (on, A4) holds for them.
  (w.settings as Partial<WidgetSettings>).sheet ?? DEFAULT_SHEET;

export function createSheetService(deps: {
  publicUrl: string;
  /** Release engines: a run is verified with the engine of the release that made it. */
  releases?: Pick<ReleaseService, 'engine'>;
}): SheetService {
  const base = deps.publicUrl.replace(/\/$/, '');
  const verifyUrl = (runId: string) => `${base}/verify/${runId}`;

  function calculatorOf(run: Run): CalculatorDefinition {
    const calc = getCalculator(run.calculatorId);
    if (!calc) throw new AppError('internal', `run ${run.id} names a calculator this server lacks`);
    return calc;
  }

  async function render(run: Run, w: Widget, project: SheetProject): Promise<Sheet> {
    const calc = calculatorOf(run);
    // The working is printed from the engine of the run's release when the row does not hold it.
    const result = wholeResult(run, deps.releases && ((release) => deps.releases!.engine(release)));
    if (!result) throw noRun();
    const org = await Organization.findByPk(run.organizationId, { attributes: ['id', 'name'] });
    let logo: Buffer | null = null;
    if (w.settings.look.logoAssetId !== null) {
      const a = await Asset.findOne({
        where: { id: w.settings.look.logoAssetId, organizationId: w.organizationId },
      });
      // The PDF library embeds PNG and JPEG; a WebP logo is left off the sheet.
      logo = a && a.contentType !== 'image/webp' ? a.data : null;
    }
    const pdf = await renderSheet({
      paper: sheetSettings(w).paper,
      firm: { name: org?.name ?? '', color: w.settings.look.colors.primary, logo },
      widgetTitle: w.name,
      project,
      createdAt: run.createdAt,
      runId: run.id,
      system: run.unitSystem,
      calc,
      result,
      firmCautions: w.settings.cautions,
      verifyUrl: verifyUrl(run.id),
    });
    return { pdf, filename: `calculation-sheet-${run.id}.pdf` };
  }

  return {
    async forVisitor({ runId, publicKey, origin, project, store = false }) {
      const w = await Widget.findOne({ where: { publicKey } });
      if (!w || w.status !== 'live') throw noRun();
      if (!origin || !w.allowedOrigins.includes(origin.toLowerCase())) {
        throw new AppError('forbidden', 'This site is not allowed to embed this widget', {
          origin: origin ?? null,
        });
      }
      // Before the run is looked up: a widget without sheets says so for every id alike, so the
      // answer never tells whether a run exists.
      if (!sheetSettings(w).enabled)
        throw new AppError('forbidden', 'This widget does not offer calculation sheets');
      const run = await Run.findOne({ where: { id: runId, widgetId: w.id } });
      if (!run) throw noRun();
      if (store && saysSomething(project)) {
        const kept = filled(project);
        await Run.update({ sheetProject: kept }, { where: { id: run.id, widgetId: w.id } });
        run.sheetProject = kept;
      }
      return render(run, w, projectFor(run, project));
    },

    async forOrg(orgId, runId, project) {
      const run = await Run.findOne({ where: { id: runId, organizationId: orgId } });
      if (!run) throw noRun();
      const w = await Widget.findByPk(run.widgetId);
      if (!w) throw noRun();
      return render(run, w, projectFor(run, project));
    },

    forRun: (run, w) =>
      sheetSettings(w).enabled ? render(run, w, projectFor(run, {})) : Promise.resolve(null),

    async verify(runId) {
      const run = await Run.findByPk(runId);
      const stored = run?.serverResult as unknown as CalculationResult | null | undefined;
      if (!run || !stored) throw noRun();
      const calc = calculatorOf(run);
      // Re-run with the engine of the release that made the run, not whatever this server runs now.
      const engine = deps.releases ? deps.releases.engine(run.release) : { calculate };
      if (!engine)
        throw new AppError(
          'internal',
          `run ${run.id} was made by release ${run.release}, which this server lacks`,
        );
      const now = engine.calculate(run.calculatorId, run.inputs);
      const text = (v: number | null | undefined, out: CalculatorDefinition['outputs'][number]) =>
        v === null || v === undefined ? 'not defined here' : shown(v, out, run.unitSystem);
      const outputs = calc.outputs
        .filter((o) => stored.outputs[o.id] !== undefined || now.outputs[o.id] !== undefined)
        .map((o) => {
          const a = stored.outputs[o.id] ?? null;
          const b = now.outputs[o.id] ?? null;
          const agrees =
            a === null || b === null
              ? a === b
              : a === b || Math.abs(a - b) <= RELATIVE_TOLERANCE * Math.max(Math.abs(a), Math.abs(b));
          return { id: o.id, label: o.label, stored: text(a, o), recomputed: text(b, o), agrees };
        });
      const inputs = calc.inputs.flatMap((i) => {
        const v = now.inputs[i.id];
        if (v === undefined) return [];
        const t =
          i.kind === 'choice'
            ? (i.options.find((o) => o.value === v)?.label ?? String(v))
            : i.kind === 'table'
              ? Array.isArray(v)
                ? tableSummary(i, v, run.unitSystem)
                : String(v)
              : typeof v === 'number'
                ? shown(v, i, run.unitSystem)
                : String(v);
        return [{ id: i.id, label: i.label, text: t }];
      });
      return {
        runId: run.id,
        calculator: { id: calc.id, title: calc.title },
        createdAt: run.createdAt.toISOString(),
        engineVersion: { stored: stored.version, current: now.version },
        inputHash: { stored: stored.inputHash, recomputed: now.inputHash },
        inputs,
        outputs,
        agrees: stored.inputHash === now.inputHash && outputs.every((o) => o.agrees),
      };
    },
  };
}

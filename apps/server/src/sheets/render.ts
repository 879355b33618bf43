import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import QRCode from 'qrcode';
import { headline } from '@wickstone/calc-core/answer';
import { formatValue } from '@wickstone/calc-core/format';
import { withUnit } from '@wickstone/calc-core/display';
import { showTable } from '@wickstone/calc-core/table';
import type {
  CalculationResult,
  CalculatorDefinition,
  UnitSystemId,
  WorkingStep,
} from '@wickstone/calc-core';
import type { PaperSize, SheetProject } from '@wickstone/contracts';
import { ESTIMATE_NOTE } from '../embed/mail.js';
import { shown } from '../embed/format.js';

// DejaVu Sans (from npm, shipped with the app) covers the Greek letters, super- and subscripts and
// maths signs the working uses; the brand font's npm files are split into script subsets, so a formula
// such as "h = 2γ cos θ / (ρ g r)" would need several fonts per line.
const require = createRequire(import.meta.url);
const font = (file: string) => readFileSync(require.resolve(`dejavu-fonts-ttf/ttf/${file}`));
/** Read once per process, not once per sheet. */
export const SHEET_FONTS = {
  regular: font('DejaVuSans.ttf'),
  bold: font('DejaVuSans-Bold.ttf'),
  mono: font('DejaVuSansMono.ttf'),
};

/** Everything one sheet prints; the caller loads it, this module only lays it out. */
export interface SheetData {
  paper: PaperSize;
  firm: { name: string; color: string; logo: Buffer | null };
  widgetTitle: string;
  project: SheetProject;
  createdAt: Date;
  runId: string;
  system: UnitSystemId;
  calc: CalculatorDefinition;
  result: CalculationResult;
  firmCautions: string;
  verifyUrl: string;
}

const PAPER = { a4: 'A4', letter: 'LETTER' } as const;
const MARGIN = 50;
const INK = '#1b2a30';
const MUTED = '#4b5d66';

/** `2026-12-02 02:10:33 UTC`: the zone is always printed, and always UTC, so two sheets compare. */
export function sheetTime(d: Date): string {
  return `${d.toISOString().slice(0, 19).replace('T', ' ')} UTC`;
}

/** The withheld outputs and their reasons: a figure is never printed beside "meaningless". */
function withheldReason(result: CalculationResult, outputId: string): string | null {
  const w = result.warnings.find((x) => (x.withholds ?? []).includes(outputId));
  return w ? w.message : null;
}

export async function renderSheet(data: SheetData): Promise<Buffer> {
  const { calc, result, system } = data;
  const doc = new PDFDocument({
    size: PAPER[data.paper],
    margins: { top: MARGIN, bottom: MARGIN + 20, left: MARGIN, right: MARGIN },
    bufferPages: true,
    info: {
      Title: `${data.widgetTitle}: calculation sheet`,
      Author: data.firm.name,
      Subject: `Run ${data.runId}`,
      Creator: 'Wickstone',
    },
  });
  doc.registerFont('regular', SHEET_FONTS.regular);
  doc.registerFont('bold', SHEET_FONTS.bold);
  doc.registerFont('mono', SHEET_FONTS.mono);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const left = MARGIN;
  const width = doc.page.width - 2 * MARGIN;
  const bottom = () => doc.page.height - doc.page.margins.bottom;
  /** Start a new page unless `height` points still fit on this one. */
  const keep = (height: number) => {
    if (doc.y + height > bottom()) doc.addPage();
  };
  /** A section title, moved to the next page with its section's first `room` points, never left alone. */
  const heading = (text: string, room = 40) => {
    keep(room);
    doc.moveDown(0.6).font('bold').fontSize(11).fillColor(data.firm.color).text(text, left, doc.y, { width });
    doc.moveDown(0.2).fillColor(INK);
  };
  const para = (
    text: string,
    opts: { size?: number; color?: string; font?: string; indent?: number } = {},
  ) => {
    doc
      .font(opts.font ?? 'regular')
      .fontSize(opts.size ?? 9)
      .fillColor(opts.color ?? INK)
      .text(text, left + (opts.indent ?? 0), doc.y, { width: width - (opts.indent ?? 0) });
  };
  /** Label and value side by side; `mono` values (hashes, ids) are set small enough to stay on one line. */
  const rows = (pairs: [string, string, 'mono'?][]) => {
    for (const [k, v, mono] of pairs) {
      doc.font('regular').fontSize(9);
      const kh = doc.heightOfString(k, { width: 150 });
      doc.font(mono ? 'mono' : 'regular').fontSize(mono ? 8 : 9);
      const h = Math.max(kh, doc.heightOfString(v, { width: width - 160 }));
      keep(h + 2);
      const y = doc.y;
      doc.fillColor(INK).text(v, left + 160, y, { width: width - 160 });
      doc.font('regular').fontSize(9).fillColor(MUTED).text(k, left, y, { width: 150 });
      doc.y = y + h + 2;
    }
  };

  // Masthead: brand bar, logo, firm and title.
  doc.rect(0, 0, doc.page.width, 8).fill(data.firm.color);
  let titleLeft = left;
  if (data.firm.logo) {
    try {
      doc.image(data.firm.logo, left, MARGIN - 10, { fit: [90, 40] });
      titleLeft = left + 100;
    } catch {
      // A logo the PDF library cannot read (WebP) is left out rather than failing the sheet.
    }
  }
  doc
    .font('bold')
    .fontSize(10)
    .fillColor(data.firm.color)
    .text(data.firm.name, titleLeft, MARGIN - 8, {
      width: width - (titleLeft - left),
    });
  doc
    .font('bold')
    .fontSize(16)
    .fillColor(INK)
    .text(data.widgetTitle, titleLeft, doc.y, {
      width: width - (titleLeft - left),
    });
  para(`Calculation sheet · ${calc.title}`, { color: MUTED });
  doc.y = Math.max(doc.y, MARGIN + 36);
  doc.moveDown(0.5);

  const project: [string, string][] = [];
  if (data.project.project) project.push(['Project / site', data.project.project]);
  if (data.project.preparedFor) project.push(['Prepared for', data.project.preparedFor]);
  if (data.project.note) project.push(['Note', data.project.note]);
  if (project.length) {
    heading('Project');
    rows(project);
  }

  heading('Record');
  rows([
    ['Date and time', sheetTime(data.createdAt)],
    ['Run id', data.runId, 'mono'],
    ['Engine version', `calc-core ${result.version}`],
    ['Input hash (SHA-256)', result.inputHash, 'mono'],
    ['Units shown', system === 'si' ? 'SI' : 'US customary, with SI'],
  ]);

  heading('Inputs');
  const inputs: [string, string][] = [];
  for (const input of calc.inputs) {
    const v = result.inputs[input.id];
    if (v === undefined) continue;
    if (input.kind === 'choice') {
      inputs.push([input.label, input.options.find((o) => o.value === v)?.label ?? String(v)]);
    } else if (input.kind === 'table') {
      if (!Array.isArray(v)) continue;
      const t = showTable(input, v, system);
      const head = t.columns.map((c) => `${c.label} (${c.unit})`).join('   ');
      inputs.push([input.label, [head, ...t.text.map((r) => r.join('   '))].join('\n')]);
    } else if (typeof v === 'number') {
      const entered = shown(v, input, system);
      const si = shown(v, input, 'si');
      inputs.push([input.label, entered === si ? entered : `${entered}   (SI: ${si})`]);
    }
  }
  rows(inputs);

  heading('Result');
  // The answer in one sentence, in the visitor's units, exactly as the widget wrote it.
  para(headline(calc, result, system).text, { font: 'bold', size: 11 });
  doc.moveDown(0.3);
  const outputs: [string, string][] = [];
  for (const out of calc.outputs) {
    const v = result.outputs[out.id];
    const reason = withheldReason(result, out.id);
    if (v === null && reason) {
      outputs.push([out.label, `not defined here: ${reason}`]);
      continue;
    }
    if (v === undefined || v === null) continue;
    const band = result.band?.outputs[out.id];
    const si = shown(v, out, 'si');
    const text = shown(v, out, system) + (si === shown(v, out, system) ? '' : `   (SI: ${si})`);
    outputs.push([
      out.label,
      band ? `${text}\nband ${shown(band.low, out, system)} to ${shown(band.high, out, system)}` : text,
    ]);
  }
  rows(outputs);
  if (result.band?.basis.length) {
    para('The band spans these inputs over their published ranges:', { color: MUTED, size: 8 });
    for (const b of result.band.basis) {
      const input = calc.inputs.find((i) => i.id === b.input);
      const range =
        input && input.kind !== 'choice' && input.kind !== 'table'
          ? `${shown(b.low, input, system)} to ${shown(b.high, input, system)}`
          : `${b.low} to ${b.high}`;
      para(`${input?.label ?? b.input}: ${range} (${b.source})`, { color: MUTED, size: 8, indent: 10 });
    }
  }

  const general = result.warnings.filter((w) => !w.step || !result.working.some((s) => s.id === w.step));
  if (general.length) {
    heading('Validity warnings');
    for (const w of general) para(`⚠ ${w.message}`, { indent: 4 });
  }

  if (result.assumptions.length) {
    heading('Assumptions');
    for (const a of result.assumptions) para(`• ${a}`, { indent: 4 });
  }

  heading('Working');
  result.working.forEach((step, i) => drawStep(step, i + 1));

  heading('References');
  for (const r of calc.references) para(`[${r.id}] ${r.citation}. Used for: ${r.usedFor}.`, { indent: 4 });

  heading('Cautions');
  // The result's own (the liquid's hazard first, the estimate statement among them), then the firm's.
  for (const c of result.cautions) para(`• ${c.text}${c.source ? ` (${c.source})` : ''}`, { indent: 4 });
  if (data.firmCautions) para(`• ${data.firm.name}: ${data.firmCautions}`, { indent: 4 });
  // Said once: the calculator's own estimate caution already makes the statement.
  if (!result.cautions.some((c) => c.code === 'ESTIMATE_ONLY')) para(`• ${ESTIMATE_NOTE}`, { indent: 4 });

  heading('Sign-off', 90);
  const col = width / 3;
  const signY = doc.y + 4;
  ['Prepared by', 'Checked by', 'Approved by'].forEach((label, i) => {
    const x = left + i * col;
    doc
      .font('regular')
      .fontSize(8)
      .fillColor(MUTED)
      .text(label, x, signY, { width: col - 12 });
    doc
      .moveTo(x, signY + 34)
      .lineTo(x + col - 16, signY + 34)
      .strokeColor(MUTED)
      .lineWidth(0.5)
      .stroke();
    doc.text('Name, signature, date', x, signY + 37, { width: col - 12 });
  });
  doc.y = signY + 56;

  heading('Verification', 120);
  const qr = await QRCode.toBuffer(data.verifyUrl, {
    type: 'png',
    margin: 1,
    width: 240,
    errorCorrectionLevel: 'M',
  });
  const qrY = doc.y;
  doc.image(qr, left, qrY, { width: 80 });
  doc.font('regular').fontSize(9).fillColor(INK);
  doc.text('Anyone can check this result against the engine at:', left + 95, qrY + 8, { width: width - 95 });
  doc
    .font('mono')
    .fontSize(9)
    .text(data.verifyUrl, left + 95, doc.y + 2, { width: width - 95, link: data.verifyUrl });
  doc
    .font('regular')
    .fontSize(8)
    .fillColor(MUTED)
    .text(
      'The page re-runs the stored inputs and says whether the outputs agree with this sheet. It shows no personal data.',
      left + 95,
      doc.y + 4,
      { width: width - 95 },
    );
  doc.y = Math.max(doc.y, qrY + 84);

  // Footer on every page: the run it belongs to, and where it is in the sheet.
  const range = doc.bufferedPageRange();
  for (let p = range.start; p < range.start + range.count; p++) {
    doc.switchToPage(p);
    const y = doc.page.height - MARGIN + 4;
    doc.page.margins.bottom = 0;
    doc.font('regular').fontSize(7).fillColor(MUTED);
    doc.text(`${data.firm.name} · run ${data.runId}`, left, y, { width: width - 80, lineBreak: false });
    doc.text(`Page ${p - range.start + 1} of ${range.count}`, left + width - 80, y, {
      width: 80,
      align: 'right',
      lineBreak: false,
    });
  }
  doc.end();
  return done;

  /** One working step as a block that is never split across a page, with its warnings beside it. */
  function drawStep(step: WorkingStep, n: number): void {
    const warnings = result.warnings.filter((w) => w.step !== undefined && w.step === step.id);
    const lines: { text: string; font: string; color: string; indent: number }[] = [
      { text: `${n}. ${step.label}`, font: 'bold', color: INK, indent: 0 },
      { text: step.formula, font: 'regular', color: INK, indent: 14 },
      { text: `= ${step.substituted}`, font: 'regular', color: INK, indent: 14 },
      { text: `= ${withUnit(formatValue(step.value), step.unit)}`, font: 'regular', color: INK, indent: 14 },
      { text: `Source: ${step.source ?? 'none given'}`, font: 'regular', color: MUTED, indent: 14 },
      ...warnings.map((w) => ({ text: `⚠ ${w.message}`, font: 'bold', color: '#8a3b00', indent: 14 })),
    ];
    doc.fontSize(9);
    const height =
      lines.reduce((h, l) => h + doc.font(l.font).heightOfString(l.text, { width: width - l.indent }), 0) + 6;
    keep(height);
    for (const l of lines) para(l.text, { font: l.font, color: l.color, indent: l.indent });
    doc.moveDown(0.4);
  }
}

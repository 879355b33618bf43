// What a calculation sheet costs to make (issue 12): time per sheet (p50/p95), bytes per sheet and
// sheets per second on this machine, for each calculator at its defaults on both paper sizes. The
// baseline, measured in the same run, is a one-line PDF with the same embedded fonts and a QR code:
// the fixed price of the library, so the ratio shows what the sheet's own layout adds.
// Run: npx tsx apps/server/bench/sheets.ts   (BENCH_ROUNDS=40 by default)
import PDFDocument from 'pdfkit';
import QRCode from 'qrcode';
import { calculate, calculators } from '@wickstone/calc-core';
import { renderSheet, SHEET_FONTS } from '../src/sheets/render.js';

const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 40);
const URL = 'https://app.wickstone.example/verify/5b1f6a3e-1111-4222-8333-444455556666';

async function baseline(): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4' });
  doc.registerFont('regular', SHEET_FONTS.regular);
  doc.registerFont('mono', SHEET_FONTS.mono);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));
  doc.font('regular').text('Calculation sheet');
  doc.font('mono').text(URL);
  doc.image(await QRCode.toBuffer(URL, { type: 'png', margin: 1, width: 240 }), { width: 80 });
  doc.end();
  return done;
}

async function measure(
  make: () => Promise<Buffer>,
): Promise<{ p50: number; p95: number; bytes: number; perS: number }> {
  await make(); // warm the JIT and the font parser
  const times: number[] = [];
  let bytes = 0;
  const t0 = performance.now();
  for (let i = 0; i < ROUNDS; i++) {
    const s = performance.now();
    bytes = (await make()).length;
    times.push(performance.now() - s);
  }
  const total = performance.now() - t0;
  times.sort((a, b) => a - b);
  const at = (q: number) => times[Math.min(times.length - 1, Math.ceil(q * times.length) - 1)] ?? 0;
  return { p50: at(0.5), p95: at(0.95), bytes, perS: (ROUNDS * 1000) / total };
}

const line = (
  name: string,
  m: Awaited<ReturnType<typeof measure>>,
  base?: Awaited<ReturnType<typeof measure>>,
) =>
  console.log(
    `${name.padEnd(36)} p50 ${m.p50.toFixed(1).padStart(6)} ms  p95 ${m.p95.toFixed(1).padStart(6)} ms  ` +
      `${(m.bytes / 1024).toFixed(1).padStart(6)} KiB  ${m.perS.toFixed(1).padStart(5)} sheets/s` +
      (base
        ? `  (${(m.p50 / base.p50).toFixed(1)}× baseline time, ${(m.bytes / base.bytes).toFixed(1)}× bytes)`
        : ''),
  );

console.log(`calculation sheets, ${ROUNDS} rounds each, node ${process.version}, one process`);
const base = await measure(baseline);
line('baseline: one line, fonts, QR', base);
for (const calc of calculators) {
  const result = calculate(calc.id, {});
  for (const paper of ['a4', 'letter'] as const) {
    const m = await measure(() =>
      renderSheet({
        paper,
        firm: { name: 'Brackenridge Ground Ltd', color: '#1d4e5f', logo: null },
        widgetTitle: calc.title,
        project: {
          project: 'Mill Lane plot 4',
          preparedFor: 'Harrow Vale Homes',
          note: 'Screening estimate.',
        },
        createdAt: new Date(),
        runId: '5b1f6a3e-1111-4222-8333-444455556666',
        system: 'si',
        calc,
        result,
        firmCautions: 'Ask us before relying on this figure.',
        verifyUrl: URL,
      }),
    );
    line(`${calc.id} (${paper})`, m, base);
  }
}

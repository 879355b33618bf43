import type { CalculationResult, CalculatorDefinition, UnitSystemId } from '@wickstone/calc-core';
import type { Lead } from '../db/models/index.js';
import type { OutgoingMail } from '../mail/mailer.js';
import { escapeHtml, oneLine } from '../mail/templates.js';
import { resultLines } from './format.js';

/** The estimate disclaimer every copy of a result carries, as the widget shows it. */
export const ESTIMATE_NOTE =
  'These results are estimates from idealised models. They do not replace a site investigation, laboratory testing, ' +
  'or the judgement of a licensed professional working under your local building codes.';

function html(title: string, blocks: string[]): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(title)}</title></head>
<body style="margin:0;padding:24px;font-family:Arial,sans-serif;color:#1b2a30">
<h1 style="font-size:18px">${escapeHtml(title)}</h1>
${blocks.join('\n')}
</body></html>`;
}

const pre = (lines: string[]) =>
  `<pre style="font-family:Menlo,Consolas,monospace;font-size:13px;white-space:pre-wrap">${escapeHtml(lines.join('\n'))}</pre>`;

export function leadNotificationMail(p: {
  to: string;
  orgName: string;
  widgetName: string;
  lead: Lead;
  link: string;
  calc: CalculatorDefinition | undefined;
  result: CalculationResult | null;
  system: UnitSystemId;
}): OutgoingMail {
  const who = p.lead.name ?? p.lead.email ?? 'A visitor';
  const title = `New site-assessment request from ${oneLine(who)} (${oneLine(p.widgetName)})`;
  const contact = [
    ['Name', p.lead.name],
    ['E-mail', p.lead.email],
    ['Company', p.lead.company],
    ['Phone', p.lead.phone],
    ['Site address', p.lead.siteAddress],
    ['Message', p.lead.message],
    ['Sent from', p.lead.origin],
  ]
    .filter(([, v]) => v)
    .map(([k, v]) => `${k}: ${v}`);
  const result = p.calc && p.result ? resultLines(p.calc, p.result, p.system) : [];
  const text = [title, '', ...contact, '', `Open the request: ${p.link}`, '', ...result].join('\n');
  return {
    to: p.to,
    subject: title,
    text,
    html: html(title, [
      pre(contact),
      `<p><a href="${escapeHtml(p.link)}">Open the request in Wickstone</a></p>`,
      pre(result),
    ]),
  };
}

export function resultCopyMail(p: {
  to: string;
  orgName: string;
  widgetName: string;
  calc: CalculatorDefinition;
  result: CalculationResult;
  system: UnitSystemId;
  firmCautions: string;
}): OutgoingMail {
  const title = `Your ${oneLine(p.widgetName)} result from ${oneLine(p.orgName)}`;
  const cautions = [
    // The result's own cautions: the liquid's hazard first, then the calculator's.
    ...p.result.cautions.map((c) => (c.source ? `${c.text} (${c.source})` : c.text)),
    ...(p.firmCautions ? [p.firmCautions] : []),
    ESTIMATE_NOTE,
  ];
  const lines = resultLines(p.calc, p.result, p.system);
  const text = [
    `Thank you for your request. ${oneLine(p.orgName)} will be in touch.`,
    '',
    ...lines,
    '',
    'Cautions',
    ...cautions.map((c) => `  - ${c}`),
    '',
    `Calculation core ${p.result.version}, input hash ${p.result.inputHash}`,
  ].join('\n');
  return {
    to: p.to,
    subject: title,
    text,
    html: html(title, [
      `<p>Thank you for your request. ${escapeHtml(oneLine(p.orgName))} will be in touch.</p>`,
      pre(lines),
      `<h2 style="font-size:15px">Cautions</h2><ul>${cautions.map((c) => `<li>${escapeHtml(c)}</li>`).join('')}</ul>`,
      `<p style="font-size:12px;color:#4b5d66">Calculation core ${escapeHtml(p.result.version)}, input hash ${escapeHtml(p.result.inputHash)}</p>`,
    ]),
  };
}

import type { CalculationResult, CalculatorDefinition, UnitSystemId } from '@wickstone/calc-core';
import { headline } from '@wickstone/calc-core/answer';
import type { Lead } from '../db/models/index.js';
import type { OutgoingMail } from '../mail/mailer.js';
import { escapeHtml, oneLine } from '../mail/templates.js';
import { resultLines } from './format.js';

/** The estimate disclaimer every copy of a result carries, as the widget shows it. */
export const ESTIMATE_NOTE =
  'These results are estimates from idealised models. They do not replace a site investigation, laboratory testing, ' +
  'or the judgement of a licensed professional working under your local building codes.';

/** The firm as its mail shows it: its name, its colours, its logo (an absolute URL) if it has one. */
export interface FirmBrand {
  name: string;
  colors: { primary: string; primaryText: string };
  logoUrl: string | null;
}

/** A value for an inline style: only `#rrggbb` reaches the markup (settings are validated, but mail is read elsewhere). */
const hex = (c: string, fallback: string) => (/^#[0-9a-f]{6}$/i.test(c) ? c : fallback);

/**
 * The result's cautions in order (the liquid's hazard first), then the firm's, and the estimate
 * statement once: the calculator's own estimate caution already makes it when present.
 */
export function cautionsOf(result: CalculationResult, firmCautions: string): string[] {
  return [
    ...result.cautions.map((c) => (c.source ? `${c.text} (${c.source})` : c.text)),
    ...(firmCautions ? [firmCautions] : []),
    ...(result.cautions.some((c) => c.code === 'ESTIMATE_ONLY') ? [] : [ESTIMATE_NOTE]),
  ];
}

/**
 * A mail in the firm's look: a band in its colour with its logo and name, white body, a quiet
 * footer. Table layout and inline styles, since mail programs ignore style sheets and flexbox.
 */
function branded(brand: FirmBrand, title: string, blocks: string[], footer: string): string {
  const band = hex(brand.colors.primary, '#1d4e5f');
  const onBand = hex(brand.colors.primaryText, '#ffffff');
  const logo = brand.logoUrl
    ? `<img src="${escapeHtml(brand.logoUrl)}" alt="" height="40" style="display:block;height:40px;max-width:160px;border:0;margin:0 0 10px">`
    : '';
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width"><title>${escapeHtml(title)}</title></head>
<body style="margin:0;padding:0;background:#f3f4f2;color:#1b2a30;font-family:Arial,Helvetica,sans-serif">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="background:#f3f4f2"><tr><td align="center" style="padding:24px 12px">
<table role="presentation" width="600" cellpadding="0" cellspacing="0" style="width:100%;max-width:600px;background:#ffffff;border:1px solid #d9dedb">
<tr><td style="background:${band};color:${onBand};padding:20px 24px">${logo}<div style="font-size:13px;letter-spacing:0.02em">${escapeHtml(brand.name)}</div>
<h1 style="margin:4px 0 0;font-size:20px;line-height:1.3;color:${onBand}">${escapeHtml(title)}</h1></td></tr>
<tr><td style="padding:20px 24px;font-size:15px;line-height:1.5">
${blocks.join('\n')}
</td></tr>
<tr><td style="padding:14px 24px 20px;border-top:1px solid #e3e7e5;font-size:12px;line-height:1.5;color:#4b5d66">${footer}</td></tr>
</table></td></tr></table>
</body></html>`;
}

const para = (s: string, style = '') => `<p style="margin:0 0 14px${style}">${s}</p>`;
const heading = (s: string) =>
  `<h2 style="margin:20px 0 8px;font-size:16px;line-height:1.3">${escapeHtml(s)}</h2>`;

/** Two-column rows (label, value): the figures line up in any mail program. */
function rows(pairs: [string, string][]): string {
  if (!pairs.length) return '';
  const tr = pairs
    .map(
      ([k, v]) =>
        `<tr><td style="padding:4px 12px 4px 0;color:#4b5d66;vertical-align:top">${escapeHtml(k)}</td><td style="padding:4px 0;font-weight:bold;vertical-align:top${v.length <= 24 ? ';white-space:nowrap' : ''}">${escapeHtml(v)}</td></tr>`,
    )
    .join('');
  return `<table role="presentation" cellpadding="0" cellspacing="0" style="margin:0 0 8px;font-size:14px">${tr}</table>`;
}

/**
 * `resultLines` as sections: an indented line is a row of its section ("  Rise: 14.8 mm"), a line
 * without indent a section title. The plain-text part prints the lines as they are.
 */
function sectionsOf(lines: string[]): string {
  const out: string[] = [];
  let pairs: [string, string][] = [];
  let list: string[] = [];
  const flush = () => {
    out.push(rows(pairs));
    if (list.length)
      out.push(
        `<ul style="margin:0 0 8px;padding-left:20px;font-size:14px">${list.map((l) => `<li>${escapeHtml(l)}</li>`).join('')}</ul>`,
      );
    pairs = [];
    list = [];
  };
  let working = false;
  for (const line of lines) {
    if (line === '') continue;
    if (!line.startsWith(' ')) {
      flush();
      out.push(heading(line));
      working = line === 'Working';
      continue;
    }
    const t = line.trim();
    if (working) {
      // A step: its label and formula, then its lines indented further (substitution, value, source).
      if (!line.startsWith('    ')) list.push(t);
      else list[list.length - 1] = `${list[list.length - 1] ?? ''} ${t}`;
      continue;
    }
    const at = t.indexOf(': ');
    if (t.startsWith('- ')) list.push(t.slice(2));
    else if (at > 0 && !t.startsWith('=') && !t.startsWith('('))
      pairs.push([t.slice(0, at), t.slice(at + 2)]);
    else list.push(t);
  }
  flush();
  return out.join('\n');
}

export function leadNotificationMail(p: {
  to: string;
  brand: FirmBrand;
  widgetName: string;
  lead: Lead;
  link: string;
  calc: CalculatorDefinition | undefined;
  result: CalculationResult | null;
  system: UnitSystemId;
}): OutgoingMail {
  const who = p.lead.name ?? p.lead.email ?? 'A visitor';
  const title = `New site-assessment request from ${oneLine(who)} (${oneLine(p.widgetName)})`;
  const contact = (
    [
      ['Name', p.lead.name],
      ['E-mail', p.lead.email],
      ['Company', p.lead.company],
      ['Phone', p.lead.phone],
      ['Site address', p.lead.siteAddress],
      ['Message', p.lead.message],
      ['Sent from', p.lead.origin],
    ] as [string, string | null][]
  ).filter((e): e is [string, string] => Boolean(e[1]));
  // The firm's own copy keeps the warning codes: its analysts see the same codes in the dashboard.
  const result = p.calc && p.result ? resultLines(p.calc, p.result, p.system) : [];
  // The answer the visitor read, in their units, as the widget wrote it.
  const answer = p.calc && p.result ? headline(p.calc, p.result, p.system).text : '';
  const replyHint = p.lead.email ? 'Reply to this e-mail to answer the visitor directly.' : '';
  const text = [
    title,
    '',
    ...contact.map(([k, v]) => `${k}: ${v}`),
    '',
    `Open the request: ${p.link}`,
    ...(replyHint ? ['', replyHint] : []),
    ...(answer ? ['', `The visitor read: ${answer}`] : []),
    '',
    ...result,
  ].join('\n');
  return {
    to: p.to,
    fromName: `${oneLine(p.brand.name)} via Wickstone`,
    // The visitor's own address: the firm answers with one click.
    ...(p.lead.email ? { replyTo: { name: oneLine(p.lead.name ?? ''), address: p.lead.email } } : {}),
    subject: title,
    text,
    html: branded(
      p.brand,
      title,
      [
        heading('Who is asking'),
        rows(contact),
        para(
          `<a href="${escapeHtml(p.link)}" style="display:inline-block;background:${hex(p.brand.colors.primary, '#1d4e5f')};color:${hex(p.brand.colors.primaryText, '#ffffff')};padding:10px 18px;text-decoration:none;font-weight:bold">Open the request in Wickstone</a>`,
          ';margin-top:8px',
        ),
        ...(replyHint ? [para(escapeHtml(replyHint), ';font-size:13px;color:#4b5d66')] : []),
        ...(answer ? [heading('What the visitor read'), para(escapeHtml(answer), ';font-weight:bold')] : []),
        sectionsOf(result),
      ],
      'Sent by Wickstone for your firm: a visitor asked for a site assessment through one of your calculators.',
    ),
  };
}

/**
 * The copy of a result a visitor asked for. It goes to an address the visitor typed, under the
 * firm's name, so nothing else they typed is in it but their name (no message, company or other
 * free text that could turn it into someone else's letter), and it says why it came. Inputs the
 * firm hid from its visitors are left out (the attached sheet lists every input for a checker).
 */
export function resultCopyMail(p: {
  to: string;
  visitorName: string | null;
  brand: FirmBrand;
  /** Where the visitor's reply goes: the firm's notification addresses. */
  replyTo: string[];
  widgetName: string;
  /** The page's origin: one the firm allowed for this widget, not something the visitor typed. */
  origin: string;
  calc: CalculatorDefinition;
  result: CalculationResult;
  system: UnitSystemId;
  firmCautions: string;
  /** Inputs the firm hid from visitors (set by the firm, not shown in the widget). */
  hiddenInputs: readonly string[];
}): OutgoingMail {
  const firm = oneLine(p.brand.name);
  const title = `Your ${oneLine(p.widgetName)} result from ${firm}`;
  const greeting = p.visitorName ? `Hello ${oneLine(p.visitorName)},` : 'Hello,';
  const thanks = `Thank you for your request. ${firm} will be in touch${p.replyTo.length ? '; you can also reply to this e-mail' : ''}.`;
  const why =
    `You received this e-mail because this address was entered, with a request for a copy of the result, ` +
    `in the ${oneLine(p.widgetName)} calculator on ${p.origin}. If that was not you, you can ignore it: ` +
    'nothing else will be sent to you.';
  const cautions = cautionsOf(p.result, p.firmCautions);
  // The answer in one sentence, in the visitor's units, exactly as the widget wrote it.
  const answer = headline(p.calc, p.result, p.system).text;
  const lines = resultLines(p.calc, p.result, p.system, {
    hide: new Set(p.hiddenInputs),
    codes: false,
  });
  const footnote = `Calculation core ${p.result.version}, input hash ${p.result.inputHash}. The attached calculation sheet lists every input and step.`;
  const text = [
    greeting,
    '',
    thanks,
    '',
    answer,
    '',
    ...lines,
    '',
    'Before relying on this',
    ...cautions.map((c) => `  - ${c}`),
    '',
    footnote,
    '',
    why,
  ].join('\n');
  return {
    to: p.to,
    fromName: `${firm} via Wickstone`,
    ...(p.replyTo.length ? { replyTo: p.replyTo } : {}),
    subject: title,
    text,
    html: branded(
      p.brand,
      title,
      [
        para(escapeHtml(greeting)),
        para(escapeHtml(thanks)),
        para(escapeHtml(answer), ';font-size:18px;font-weight:bold;margin-top:16px'),
        sectionsOf(lines),
        heading('Before relying on this'),
        `<ul style="margin:0 0 14px;padding-left:20px;font-size:14px">${cautions.map((c) => `<li style="margin:0 0 6px">${escapeHtml(c)}</li>`).join('')}</ul>`,
        para(escapeHtml(footnote), ';font-size:12px;color:#4b5d66'),
      ],
      escapeHtml(why),
    ),
  };
}

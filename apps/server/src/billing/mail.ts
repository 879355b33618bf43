import type { OutgoingMail } from '../mail/mailer.js';
import { dashboardLink, escapeHtml, layout, oneLine } from '../mail/templates.js';

export function allowanceMail(p: {
  to: string;
  orgName: string;
  orgId: number;
  planName: string;
  level: number;
  used: number;
  allowance: number;
  month: string;
  publicUrl: string;
}): OutgoingMail {
  const org = oneLine(p.orgName);
  const full = p.level >= 100;
  const title = full
    ? `${org} has used this month's ${p.allowance.toLocaleString('en-GB')} logged runs`
    : `${org} has used ${p.level} % of this month's logged runs`;
  const lines = [
    `${p.used.toLocaleString('en-GB')} of the ${p.allowance.toLocaleString('en-GB')} runs the ${p.planName} plan logs in ${p.month} are used.`,
    full
      ? 'Your widgets keep calculating for your visitors, and every further run is still stored, marked as over the allowance.'
      : 'Nothing changes for your visitors. Past the allowance, runs are still stored and marked as over it.',
    'A larger plan raises the allowance from the day you change.',
  ];
  const url = dashboardLink(p.publicUrl, `/orgs/${p.orgId}/billing`);
  return {
    to: p.to,
    subject: `Wickstone: ${title}`,
    text: [title, '', ...lines, '', `Plans and billing: ${url}`].join('\n'),
    html: layout(
      title,
      lines.map(escapeHtml),
      { label: 'See plans and billing', url },
      'You get this because you own this firm in Wickstone.',
    ),
  };
}

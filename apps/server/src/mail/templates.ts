import type { Role } from '@wickstone/contracts';
import type { OutgoingMail } from './mailer.js';

export const escapeHtml = (s: string): string =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c,
  );

/** Names come from users: keep them on one line in a subject. */
export const oneLine = (s: string): string => s.replace(/[\r\n\t]+/g, ' ').trim();

export function layout(
  title: string,
  paragraphs: string[],
  action: { label: string; url: string },
  footer: string,
): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 16px">${p}</p>`).join('\n');
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(title)}</title></head>
<body style="margin:0;padding:24px;background:#f4f6f5;font-family:Manrope,Arial,sans-serif;color:#1c2522">
<div style="max-width:560px;margin:0 auto;background:#ffffff;border-radius:8px;padding:32px">
<h1 style="font-size:20px;margin:0 0 16px">${escapeHtml(title)}</h1>
${body}
<p style="margin:24px 0"><a href="${escapeHtml(action.url)}" style="background:#1f6f5c;color:#ffffff;padding:12px 20px;border-radius:6px;text-decoration:none;font-weight:600">${escapeHtml(action.label)}</a></p>
<p style="margin:0 0 16px;font-size:13px;color:#5b6662">Or paste this address into your browser: ${escapeHtml(action.url)}</p>
<p style="margin:0;font-size:13px;color:#5b6662">${footer}</p>
</div></body></html>`;
}

const roleNames: Record<Role, string> = {
  owner: 'an owner',
  admin: 'an admin',
  analyst: 'an analyst',
  developer: 'a developer',
};

export function invitationMail(p: {
  to: string;
  organizationName: string;
  inviterName: string;
  role: Role;
  link: string;
  expiresAt: Date;
}): OutgoingMail {
  const expires = p.expiresAt.toUTCString();
  const title = `Join ${oneLine(p.organizationName)} on Wickstone`;
  const text = [
    `${oneLine(p.inviterName)} has invited you to join ${oneLine(p.organizationName)} on Wickstone as ${roleNames[p.role]}.`,
    '',
    `Accept the invitation: ${p.link}`,
    '',
    `The link works once and until ${expires}. If you did not expect this e-mail, ignore it.`,
  ].join('\n');
  const html = layout(
    title,
    [
      `${escapeHtml(p.inviterName)} has invited you to join <strong>${escapeHtml(p.organizationName)}</strong> on Wickstone as ${roleNames[p.role]}.`,
    ],
    { label: 'Accept the invitation', url: p.link },
    `The link works once and until ${escapeHtml(expires)}. If you did not expect this e-mail, ignore it.`,
  );
  return { to: p.to, subject: title, text, html };
}

export function passwordResetMail(p: {
  to: string;
  name: string;
  link: string;
  expiresAt: Date;
}): OutgoingMail {
  const expires = p.expiresAt.toUTCString();
  const title = 'Reset your Wickstone password';
  const text = [
    `Hello ${oneLine(p.name)},`,
    '',
    `Someone (we hope you) asked to reset the password of your Wickstone account. Choose a new one here: ${p.link}`,
    '',
    `The link works once and until ${expires}. If you did not ask for it, ignore this e-mail: your password stays as it is.`,
  ].join('\n');
  const html = layout(
    title,
    [
      `Hello ${escapeHtml(p.name)},`,
      'Someone (we hope you) asked to reset the password of your Wickstone account.',
    ],
    { label: 'Choose a new password', url: p.link },
    `The link works once and until ${escapeHtml(expires)}. If you did not ask for it, ignore this e-mail: your password stays as it is.`,
  );
  return { to: p.to, subject: title, text, html };
}

/**
 * To the holder of an account that saw a burst of failed sign-ins (OWASP ASVS 5.0 V6.3.4: users are
 * notified of suspicious authentication attempts). Nothing in it comes from whoever failed.
 */
export function signInFailuresMail(p: {
  to: string;
  name: string;
  failures: number;
  windowMinutes: number;
  resetLink: string;
}): OutgoingMail {
  const title = 'Failed sign-ins to your Wickstone account';
  const what = `Your Wickstone account has seen ${p.failures} failed sign-ins in the last ${p.windowMinutes} minutes.`;
  const calm =
    'If that was you, there is nothing to do. If not, your password held: those attempts are being slowed down, and you can still sign in from a browser you used before.';
  const advice = 'If you think someone knows your password, choose a new one.';
  const text = [`Hello ${oneLine(p.name)},`, '', what, '', calm, '', `${advice} ${p.resetLink}`].join('\n');
  const html = layout(
    title,
    [`Hello ${escapeHtml(p.name)},`, escapeHtml(what), escapeHtml(calm), escapeHtml(advice)],
    { label: 'Choose a new password', url: p.resetLink },
    'You receive this because it is your account. We send it at most once per burst.',
  );
  return { to: p.to, subject: title, text, html };
}

/** Links in e-mails point at the dashboard's pages under the public URL. */
export function dashboardLink(publicUrl: string, path: string): string {
  // Relative to the base, so a public URL with a path prefix (https://host/app/) keeps it.
  return new URL(path.replace(/^\/+/, ''), publicUrl.endsWith('/') ? publicUrl : `${publicUrl}/`).toString();
}

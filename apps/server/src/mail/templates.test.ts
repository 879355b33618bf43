import { describe, expect, it } from 'vitest';
import { dashboardLink, invitationMail, passwordResetMail } from './templates.js';

describe('e-mail templates', () => {
  const expiresAt = new Date('2026-12-08T12:00:00Z');

  it('escapes what users typed in the HTML, keeps the subject on one line, and carries the link in both parts', () => {
    const m = invitationMail({
      to: 'new@tests.example',
      organizationName: 'Damp & Co <script>alert(1)</script>',
      inviterName: 'Eve\r\nBcc: victim@tests.example',
      role: 'developer',
      link: 'http://127.0.0.1:5180/invitations/abc',
      expiresAt,
    });
    expect(m.html).not.toContain('<script>');
    expect(m.html).toContain('Damp &amp; Co &lt;script&gt;alert(1)&lt;/script&gt;');
    expect(m.subject).not.toMatch(/[\r\n]/);
    expect(m.text).not.toMatch(/Eve\r?\nBcc/);
    expect(m.text).toContain('as a developer');
    expect(m.text).toContain('http://127.0.0.1:5180/invitations/abc');
    expect(m.html).toContain('href="http://127.0.0.1:5180/invitations/abc"');
    expect(m.text).toContain(expiresAt.toUTCString());
  });

  it('writes a reset mail with the link and its expiry', () => {
    const m = passwordResetMail({
      to: 'a@tests.example',
      name: 'Ada',
      link: 'https://app.example/reset-password?token=t0k',
      expiresAt,
    });
    expect(m.subject).toBe('Reset your Wickstone password');
    expect(m.text).toContain('https://app.example/reset-password?token=t0k');
    expect(m.html).toContain('href="https://app.example/reset-password?token=t0k"');
  });

  it('builds links under the public URL, keeping a path prefix', () => {
    expect(dashboardLink('http://127.0.0.1:5180', 'invitations/x')).toBe(
      'http://127.0.0.1:5180/invitations/x',
    );
    expect(dashboardLink('https://wickstone.example/app', '/reset-password?token=y')).toBe(
      'https://wickstone.example/app/reset-password?token=y',
    );
  });
});

import { describe, expect, it } from 'vitest';
import { displayNameSchema, webUrlSchema } from './text.js';

describe('display names', () => {
  const name = displayNameSchema(120);
  // U+202A..U+202E embeddings/overrides and U+2066..U+2069 isolates (common practice for display names)
  it.each(['\u202A', '\u202B', '\u202C', '\u202D', '\u202E', '\u2066', '\u2067', '\u2068', '\u2069'])(
    'refuses U+%s',
    (c) => {
      expect(name.safeParse(`Ada ${c}gnp.exe`).success).toBe(false);
    },
  );
  it('keeps right-to-left scripts and marks that do not override', () => {
    expect(name.parse('  Yasmin \u0627\u0644\u0639\u0644\u064A \u200F ')).toBe(
      'Yasmin \u0627\u0644\u0639\u0644\u064A \u200F',
    );
    expect(name.parse('Zoë Ødegård')).toBe('Zoë Ødegård');
  });
});

describe('web page addresses', () => {
  it.each([
    'javascript:alert(1)',
    'data:text/html,<b>x</b>',
    'file:///etc/passwd',
    'ftp://files.example/a',
    'vbscript:x',
  ])('refuses %s', (u) => {
    expect(webUrlSchema.safeParse(u).success).toBe(false);
  });
  it.each(['https://site.example/page?a=1', 'http://localhost:5181/'])('accepts %s', (u) => {
    expect(webUrlSchema.parse(u)).toBe(u);
  });
});

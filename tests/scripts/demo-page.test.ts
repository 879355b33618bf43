import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { calculatorOf, demoPage } from '../../scripts/lib/demo-page.mjs';

const template = readFileSync(
  fileURLToPath(new URL('../../scripts/demo-site/index.html', import.meta.url)),
  'utf8',
);

/** A widget as the demo seed writes it to var/demo-site.json: its name and its embed snippet. */
const widget = (calculatorId: string, key: string) => ({
  name: calculatorId,
  snippet:
    `<wickstone-widget data-calculator="${calculatorId}" style="display:block;min-height:900px;--wk-held:900px"></wickstone-widget>\n` +
    `<script async src="http://127.0.0.1:5180/releases/0.3.0/wickstone-${calculatorId}.js" integrity="sha384-x" crossorigin="anonymous" data-wickstone-key="${key}"></script>`,
});

describe("the demo consultancy's page", () => {
  // The seed's four widgets, in its order.
  const seeded = [
    widget('tube-rise', 'wk_aaaaaaaaaaaaaaaaaaaa'),
    widget('soil-capillary-rise', 'wk_bbbbbbbbbbbbbbbbbbbb'),
    widget('rising-damp-height', 'VEXA-NQ0D-JK9W-6GK6-S'),
    widget('absorption-coefficient', 'Q9WB-M73M-DXDP-8JVS-T'),
  ];

  it('places every widget the seed wrote, the absorption one in its own section, and leaves no slot', () => {
    const html = demoPage(template, seeded);
    expect(html).not.toMatch(/\{\{WIDGET_[A-Z0-9_]+\}\}/);
    for (const w of seeded) expect(html.split(w.snippet)).toHaveLength(2);
    expect(html.match(/<wickstone-widget /g)).toHaveLength(4);
    // The absorption widget sits after the page's absorption section heading.
    expect(html.indexOf(seeded[3]!.snippet)).toBeGreaterThan(html.indexOf('absorption readings'));
  });

  it('reads the calculator from the snippet itself, and leaves a slot empty when no widget fills it', () => {
    expect(calculatorOf(seeded[3]!.snippet)).toBe('absorption-coefficient');
    const html = demoPage(template, seeded.slice(0, 2));
    expect(html).not.toMatch(/\{\{WIDGET_[A-Z0-9_]+\}\}/);
    expect(html.match(/<wickstone-widget /g)).toHaveLength(2);
  });
});

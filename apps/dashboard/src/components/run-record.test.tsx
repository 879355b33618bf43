// @vitest-environment happy-dom
import { cleanup, render } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { calculate } from '@wickstone/calc-core';
import type { RunDetail } from '@wickstone/contracts';
import { RunRecord, runHeadline } from './run-record';

/*
 * The run's page states the headline the visitor read: from the stored result, in the unit system
 * the visitor had chosen (not the widget's own), or nothing when no result was stored.
 */

// A 1 mm bore of water at 20 °C, as a widget would have sent it (canonical SI).
const stored = calculate('tube-rise', { diameter: 0.001 });

function run(over: Partial<RunDetail> = {}): RunDetail {
  return {
    id: '2a23a28b-ae93-4418-b9a7-c384f11450eb',
    createdAt: '2026-12-02T06:36:51.000Z',
    widget: { id: 7, name: 'Rising damp check' },
    calculator: { id: 'tube-rise', title: 'Capillary rise or depression in a tube' },
    unitSystem: 'si',
    visitorUnitSystem: 'us',
    inputs: [],
    outputs: [],
    warningCodes: [],
    origin: 'https://www.brackenridge-ground.example',
    pageUrl: null,
    release: '0.3.0',
    agreed: true,
    leadId: null,
    calcVersion: stored.version,
    inputHash: stored.inputHash,
    sentInputs: { diameter: 0.001 },
    clientResult: {},
    serverResult: JSON.parse(JSON.stringify(stored)) as Record<string, unknown>,
    mismatch: null,
    lead: null,
    ...over,
  };
}

afterEach(cleanup);

// The sentence's figures worked here from the engine's stored rise: 3 significant figures, 25.4 mm to the inch.
const rise = stored.outputs.rise as number;
const sig3 = (n: number) => String(Number(n.toPrecision(3)));
const inUs = `Water can climb about ${sig3(rise / 0.0254)} in in a ${sig3(0.001 / 0.0254)} in bore.`;
const inSi = `Water can climb about ${sig3(rise * 1000)} mm in a 1 mm bore.`;

describe('the run’s headline', () => {
  it('is written in the visitor’s units, whatever the widget opens in', () => {
    expect(runHeadline(run())).toBe(inUs);
    expect(runHeadline(run({ visitorUnitSystem: 'si', unitSystem: 'us' }))).toBe(inSi);
  });

  it('is shown on the page, and left out when no result was stored', () => {
    const { container, unmount } = render(<RunRecord run={run()} />);
    expect(container.querySelector('[data-run-headline]')?.textContent).toBe(inUs);
    unmount();
    const bare = render(<RunRecord run={run({ serverResult: null })} />);
    expect(bare.container.querySelector('[data-run-headline]')).toBeNull();
  });
});

import { embedRunBodySchema } from '@wickstone/contracts';
import { run as runSoil } from '@wickstone/calc-core/calculators/soil-capillary-rise';
import { run as runTube } from '@wickstone/calc-core/calculators/tube-rise';
import { describe, expect, it } from 'vitest';
import { buildRunBody, newRunId, pageUrlFor } from './report.js';

const UUID_V4 = /^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;

describe('buildRunBody', () => {
  it('reports the inputs calc-core used and the result, in the embed API’s shape', () => {
    const result = runTube({
      diameter: 0.0005,
      liquid: 'ethanol',
      contactAnglePreset: 'custom',
      contactAngleDeg: 10,
      temperatureC: 35,
    });
    const body = buildRunBody({
      id: newRunId(),
      publicKey: 'wk_abcdefghij0123456789',
      result,
      unitSystem: 'us',
      href: 'https://www.brackenridge-ground.example/damp?x=1',
      release: '0.1.0',
    });
    expect(embedRunBodySchema.parse(body)).toEqual(body);
    // temperatureC does not apply to a table liquid: left out, as calc-core left it out of the hash.
    expect(body.inputs).toEqual(result.inputs);
    expect(body.inputs).not.toHaveProperty('temperatureC');
    expect(body.inputs.gravity).toBe(9.80665);
    expect(body.result).toEqual({
      outputs: result.outputs,
      warnings: result.warnings.map((w) => w.code),
      inputHash: result.inputHash,
      version: result.version,
    });
    expect(body.unitSystem).toBe('us');
    expect(body.pageUrl).toBe('https://www.brackenridge-ground.example/damp?x=1');
    // The release that ran it, so the server recomputes with that release's engine.
    expect(body.release).toBe('0.1.0');
  });

  it('carries warning codes only, and nulls for outputs that do not apply', () => {
    const result = runSoil({ d10: 0.00005, breakLayer: 'none' });
    const body = buildRunBody({
      id: newRunId(),
      publicKey: 'wk_abcdefghij0123456789',
      result,
      unitSystem: 'si',
      href: 'about:blank',
    });
    expect(body.result.warnings).toContain('FINE_GRAINED_SOIL');
    expect(body.result.outputs.layerCapillaryRise).toBeNull();
    expect(body).not.toHaveProperty('pageUrl');
    expect(body).not.toHaveProperty('release');
    expect(embedRunBodySchema.safeParse(body).success).toBe(true);
  });
});

describe('pageUrlFor', () => {
  it('keeps http(s) URLs the API accepts', () => {
    expect(pageUrlFor('http://localhost:5181/')).toBe('http://localhost:5181/');
    expect(pageUrlFor('file:///tmp/page.html')).toBeUndefined();
    expect(pageUrlFor(`https://brackenridge-ground.example/?q=${'a'.repeat(2000)}`)).toBeUndefined();
  });
});

describe('newRunId', () => {
  it('uses crypto.randomUUID where it exists', () => {
    expect(
      newRunId({ randomUUID: () => '11111111-1111-4111-8111-111111111111', getRandomValues: (a) => a }),
    ).toBe('11111111-1111-4111-8111-111111111111');
  });
  it('makes a v4 UUID from getRandomValues where it does not (plain-http pages)', () => {
    const ids = new Set<string>();
    for (let i = 0; i < 50; i++) {
      const id = newRunId({ getRandomValues: (a) => crypto.getRandomValues(a) });
      expect(id).toMatch(UUID_V4);
      ids.add(id);
    }
    expect(ids.size).toBe(50);
    const zeros = newRunId({ getRandomValues: (a) => a });
    expect(zeros).toBe('00000000-0000-4000-8000-000000000000');
  });
});

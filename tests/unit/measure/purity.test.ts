import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import * as measure from '@/lib/measure';

// Project rule (issue 3): lib/measure is pure TypeScript — relative imports only, no framework,
// database, file system, clock, randomness, runtime locale data (Intl) or test-only libraries.
const dir = fileURLToPath(new URL('../../../lib/measure/', import.meta.url));
const sources = readdirSync(dir)
  .filter((f) => f.endsWith('.ts'))
  .map((f) => ({ file: f, text: readFileSync(dir + f, 'utf8') }));

describe('lib/measure purity', () => {
  it.each(sources.map((s) => [s.file, s.text] as const))('%s imports only relative paths', (_file, text) => {
    const specifiers = [...text.matchAll(/\bfrom\s+['"]([^'"]+)['"]|\bimport\s*\(\s*['"]([^'"]+)['"]|\brequire\s*\(\s*['"]([^'"]+)['"]/g)].map(
      (m) => m[1] ?? m[2] ?? m[3],
    );
    for (const s of specifiers) expect(s, `import of ${s}`).toMatch(/^\.\//);
  });

  it.each(sources.map((s) => [s.file, s.text] as const))('%s uses no clock, randomness, Intl or process', (_file, text) => {
    const code = text.replace(/\/\*[\s\S]*?\*\//g, '').replace(/\/\/.*$/gm, '');
    for (const banned of [/\bDate\b/, /Math\.random/, /\bIntl\b/, /\bprocess\./, /\bperformance\./, /\bfetch\(/]) {
      expect(code).not.toMatch(banned);
    }
  });

  it('exports the public contract of issue 3', () => {
    for (const name of [
      'MeasureError',
      'convert',
      'chargeToWh',
      'airlineBand',
      'beamDistanceM',
      'candelaFromLux',
      'lightRuntime',
      'energyWh',
      'combinedLossFraction',
      'expectedDailyWh',
      'solarOutput',
      'chargeTimeS',
      'powerBudget',
      'paretoFront',
      'summarize',
      'valueRatios',
      'CATEGORIES',
      'SPECS',
      'ISO4217_MINOR_UNITS',
    ]) {
      expect(measure, name).toHaveProperty(name);
    }
    expect(measure.CATEGORIES).toEqual(['light', 'power-bank', 'battery-12v', 'solar-panel', 'radio', 'cable-adapter', 'other']);
    // Spec keys and canonical units required by issue 3.
    expect(measure.SPECS).toMatchObject({
      mass: { unit: 'g' },
      luminousFlux: { unit: 'lm' },
      runtime: { unit: 's' },
      peakIntensity: { unit: 'cd' },
      ratedEnergy: { unit: 'Wh' },
      deliveredEnergy: { unit: 'Wh', measuredOnly: true },
      ratedPower: { unit: 'W' },
      powerDraw: { unit: 'W' },
      transmitPower: { unit: 'W' },
      supplyVoltage: { unit: 'V' },
      continuousPower: { unit: 'W' },
    });
  });

  it('MeasureError carries a code and a message', () => {
    const e = new measure.MeasureError('out-of-range', 'Mass must be at least 0, got -1.');
    expect(e).toBeInstanceOf(Error);
    expect(e.name).toBe('MeasureError');
    expect(e.code).toBe('out-of-range');
    expect(e.message).toMatch(/at least 0/);
  });
});

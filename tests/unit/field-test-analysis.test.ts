import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { parseReadings, type Sample } from '@/lib/readings';
import { analyzeFieldTest, analyzeTrial, measuredSpecs } from '@/lib/field-tests/analysis';
import { FIELD_TEST_KINDS, KINDS, SKIES } from '@/lib/field-tests/kinds';
import { chargeToWh } from '@/lib/measure';

const series = (name: string, switchOn?: string): Sample[] => {
  const r = parseReadings(new Uint8Array(readFileSync(fileURLToPath(new URL(`../fixtures/readings/${name}`, import.meta.url)))), { switchOn });
  if (!r.ok) throw new Error(r.error.message);
  return r.samples;
};
const figure = (a: ReturnType<typeof analyzeTrial>, key: string) => (a.ok ? a.figures.find((f) => f.key === key)?.value : undefined);

describe('kinds', () => {
  it('every kind has a label and the skies are the issue’s six', () => {
    for (const k of FIELD_TEST_KINDS) expect(KINDS[k].label).not.toBe('');
    expect(SKIES).toEqual(['clear', 'thin-cloud', 'broken-cloud', 'overcast', 'rain', 'indoor']);
  });
});

describe('analysis of the fixtures (answers exact by hand)', () => {
  it('lantern: ANSI/PLATO FL 1 runtime 34 800 s', () => {
    // Reference at 30 s = 400 lx; 10 % = 40 lx. The fade 300·(1 − (t − 3600)/36 000) reaches 40 at
    // t = 3600 + 36 000 × 26/30 = 34 800 s (exact by hand; the fixture samples the line at 34 800 s).
    const a = analyzeTrial('light-runtime', { itemId: 'lantern', samples: series('lantern-fade.csv') });
    expect(a.ok).toBe(true);
    expect(figure(a, 'runtime')).toBe(34_800);
    expect(figure(a, 'referenceOutput')).toBe(400);
    expect(a.ok && a.chart).toEqual({ kind: 'light', referenceValue: 400, thresholdValue: 40, runtimeS: 34_800 });
    expect(a.ok && a.methods[0]!.text).toMatch(/^ANSI\/PLATO FL 1 runtime: from switch-on to 10 % of the output at 30 s/);
  });

  it('bank: 20 + 49/600 Wh delivered, and delivered ÷ rated', () => {
    // P = V × I falls linearly 10.2 → 9.8 W over 2 h (mean 10 W → 20 Wh, the trapezoid rule is exact on a line),
    // then 9.8 → 0 W in 60 s: 9.8/2 × 60 / 3600 = 49/600 Wh. Exact by hand.
    const rated = chargeToWh(6000, 'mAh', 3.7); // 22.2 Wh, 49 CFR 171.8 (Wh = Ah × V); invented rating
    const a = analyzeTrial('energy-delivered', { itemId: 'bank', samples: series('bank-discharge.csv') }, { ratedEnergyWh: rated });
    expect(figure(a, 'deliveredEnergy')).toBeCloseTo(20 + 49 / 600, 10);
    expect(figure(a, 'deliveredVsRated')).toBeCloseTo((20 + 49 / 600) / 22.2, 10);
  });

  it('constant 5 W for 1 h is 5 Wh (typed-in readings)', () => {
    const a = analyzeTrial('energy-delivered', { itemId: 'b', samples: [{ t: 0, watts: 5 }, { t: 1800, watts: 5 }, { t: 3600, watts: 5 }] });
    expect(figure(a, 'deliveredEnergy')).toBe(5);
    expect(a.ok && a.notes).toEqual(['The item has no rated energy, so delivered ÷ rated is not shown.']);
  });

  it('panel under changing cloud: mean 30 W, peak 40 W, 0.5 of a 60 W rating', () => {
    // Trapezoids in W·min from 11:00: 0–10 min 400, 10–12 50, 12–20 80, 20–22 50, 22–30 320 → 900 W·min over 30 min = 30 W. Exact by hand.
    const a = analyzeTrial('solar-output', { itemId: 'panel', samples: series('panel-cloud.csv', '2026-09-19 11:00:00') }, { ratedW: 60 });
    expect(figure(a, 'meanPower')).toBeCloseTo(30, 12);
    expect(figure(a, 'peakPower')).toBe(40);
    expect(figure(a, 'shareOfRating')).toBeCloseTo(0.5, 12);
  });

  it('charge time: 5 % of peak held for 5 minutes (common practice, no source)', () => {
    // 18 W to 3000 s, linear to 0 W at 3600 s, then 0 W to 4200 s. 5 % of 18 W = 0.9 W is crossed at
    // 3000 + 600 × (18 − 0.9)/18 = 3570 s; it stays below to the end (630 s ≥ 300 s). Exact by hand.
    const samples = [{ t: 0, watts: 18 }, { t: 3000, watts: 18 }, { t: 3600, watts: 0 }, { t: 4200, watts: 0 }];
    expect(figure(analyzeTrial('charge-time', { itemId: 'c', samples }), 'chargeTime')).toBeCloseTo(3570, 9);
  });

  it('light output from lux at a distance: I = E d², beam distance 2√I', () => {
    // IES inverse-square law: 2000 lx at 2 m = 8000 cd; ANSI/PLATO FL 1: 2√8000 = 178.885 m.
    const a = analyzeTrial('light-output', { itemId: 'l', typed: { illuminanceLx: 2000, distanceM: 2, luminousFlux: 350 } });
    expect(figure(a, 'peakIntensity')).toBe(8000);
    expect(figure(a, 'beamDistance')).toBeCloseTo(178.885438, 5);
    expect(figure(a, 'luminousFlux')).toBe(350);
  });
});

describe('repeated trials and errors', () => {
  it('mass check: mean ± sd and n per item via summarize', () => {
    // Sample sd of 93, 94, 94 = √(1/3) = 0.57735 (exact by hand: deviations −2/3, 1/3, 1/3; Σd² = 2/3; ÷ 2).
    const a = analyzeFieldTest('mass-check', [
      { itemId: 'head', typed: { mass: 93 } },
      { itemId: 'head', typed: { mass: 94 } },
      { itemId: 'head', typed: { mass: 94 } },
      { itemId: 'lamp', typed: { mass: 428 } },
    ]);
    const specs = measuredSpecs(a);
    expect(specs[0]).toMatchObject({ itemId: 'head', key: 'mass', n: 3 });
    expect(specs[0]!.value).toBeCloseTo(281 / 3, 12);
    expect(specs[0]!.sd).toBeCloseTo(Math.sqrt(1 / 3), 12);
    expect(specs[1]).toEqual({ itemId: 'lamp', key: 'mass', value: 428, sd: null, n: 1 });
    expect(a.methods.map((m) => m.id)).toEqual(['typed', 'repeat-trials']);
  });

  it('a log without t = 30 s, a series for a typed kind, an empty trial → errors, not throws', () => {
    const late = analyzeTrial('light-runtime', { itemId: 'x', samples: [{ t: 60, value: 1 }, { t: 90, value: 1 }] });
    expect(late).toMatchObject({ ok: false, error: { code: 'no-reference' } });
    expect(analyzeTrial('mass-check', { itemId: 'x', samples: [{ t: 0, value: 1 }] })).toMatchObject({ ok: false, error: { code: 'bad-sample' } });
    expect(analyzeTrial('mass-check', { itemId: 'x' })).toMatchObject({ ok: false, error: { code: 'empty' } });
    const noRuntime = analyzeTrial('light-runtime', { itemId: 'x', samples: [{ t: 0, value: 10 }, { t: 30, value: 10 }, { t: 600, value: 9 }] });
    expect(noRuntime.ok && noRuntime.figures.map((f) => f.key)).toEqual(['referenceOutput']);
  });

  it('two lantern trials: runtime mean ± sd', () => {
    const one = series('lantern-fade.csv');
    const two = one.map((s) => ({ t: s.t >= 3600 ? s.t + 1200 : s.t, value: s.value! })); // fade 1200 s later → 36 000 s
    const a = analyzeFieldTest('light-runtime', [
      { itemId: 'lamp', samples: one },
      { itemId: 'lamp', samples: two.filter((s, i, arr) => i === 0 || s.t > arr[i - 1]!.t) },
    ]);
    const runtime = a.items[0]!.summaries.find((s) => s.key === 'runtime')!;
    expect(runtime.summary.n).toBe(2);
    expect(runtime.summary.mean).toBe(35_400);
    expect(runtime.summary.sd).toBeCloseTo(600 * Math.SQRT2, 9); // sample sd of 34 800, 36 000: 1200/√2
  });
});

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { base64ToBytes, bytesToBase64, decodeSeries, downsample, encodeSeries, parseReadings, type Sample } from '@/lib/readings';

const sameNumbers = (a: Sample[], b: Sample[]) => {
  expect(b.length).toBe(a.length);
  const diffs: string[] = [];
  for (let i = 0; i < a.length && diffs.length < 5; i++) {
    for (const k of ['t', 'value', 'watts', 'volts', 'amps'] as const) if (!Object.is(a[i]![k], b[i]![k])) diffs.push(`sample ${i} ${k}: ${a[i]![k]} vs ${b[i]![k]}`);
  }
  expect(diffs).toEqual([]);
};

const anyDouble = fc.double({ noDefaultInfinity: false, noNaN: false });
const loggerDecimal = fc.integer({ min: -1_000_000_000, max: 1_000_000_000 }).chain((n) => fc.integer({ min: 0, max: 6 }).map((k) => n / 10 ** k));

describe('encodeSeries / decodeSeries', () => {
  it('round trip is exact for any doubles (incl. -0, NaN, ±Infinity) and any field set', () => {
    fc.assert(
      fc.property(
        fc.subarray(['value', 'watts', 'volts', 'amps'] as const),
        fc.array(fc.tuple(anyDouble, anyDouble, anyDouble, anyDouble, anyDouble), { maxLength: 60 }),
        (fields, rows) => {
          const samples: Sample[] = rows.map(([t, a, b, c, d]) => {
            const s: Sample = { t };
            const vals = [a, b, c, d];
            fields.forEach((f, i) => (s[f] = vals[i]!));
            return s;
          });
          const r = decodeSeries(encodeSeries(samples));
          expect(r.ok).toBe(true);
          if (r.ok) sameNumbers(samples, r.samples);
        },
      ),
    );
  });

  it('round trip is exact for logger-style decimals (the compact path)', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(loggerDecimal, loggerDecimal), { minLength: 1, maxLength: 200 }), (rows) => {
        const samples = rows.map(([t, watts]) => ({ t, watts }));
        const bytes = encodeSeries(samples);
        const r = decodeSeries(bytes);
        expect(r.ok).toBe(true);
        if (r.ok) sameNumbers(samples, r.samples);
        const back = base64ToBytes(bytesToBase64(bytes));
        expect(back).toEqual(bytes);
      }),
    );
  });

  it('100 000 rows of a steady log: size and exactness (figures quoted in lib/readings/README.md)', () => {
    let text = 'time_s,lux\n';
    for (let i = 0; i < 100_000; i++) text += `${i * 10},${(400 - i * 0.0035).toFixed(2)}\n`;
    const r = parseReadings(text);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const bytes = encodeSeries(r.samples);
    // t: steady 10 s steps → 1 byte per row; lux in hundredths falling 0.35 → 1 byte per row (zigzag 70).
    expect(bytes.length).toBeLessThan(100_000 * 2 + 64);
    expect(bytes.length).toBeLessThan(100_000 * 16 / 7); // well under raw float64 (1.6 MB)
    const d = decodeSeries(bytes);
    expect(d.ok && d.samples.length).toBe(100_000);
    if (d.ok) sameNumbers(r.samples, d.samples);
  });

  it('damaged bytes give an error, not a throw', () => {
    const bytes = encodeSeries([{ t: 0, watts: 1.5 }, { t: 1, watts: 2 }]);
    expect(decodeSeries(bytes.slice(0, bytes.length - 1))).toMatchObject({ ok: false });
    expect(decodeSeries(new Uint8Array([1, 2, 3]))).toMatchObject({ ok: false, error: 'Stored readings are damaged (not a TBS1 series).' });
    expect(decodeSeries(new Uint8Array([...bytes, 0]))).toMatchObject({ ok: false });
    fc.assert(fc.property(fc.uint8Array({ maxLength: 64 }), (junk) => void decodeSeries(junk)));
    expect(base64ToBytes('***')).toBeNull();
  });
});

describe('downsample (min/max per bucket)', () => {
  it('keeps first, last, global min and max, order, and at most the target', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ noNaN: true, noDefaultInfinity: true }), { minLength: 1, maxLength: 3000 }), fc.integer({ min: 4, max: 500 }), (ys, target) => {
        const pts = ys.map((y, i) => ({ t: i, y }));
        const out = downsample(pts, (p) => p.y, target);
        expect(out.length).toBeLessThanOrEqual(Math.max(target, 0) < pts.length ? target : pts.length);
        expect(out[0]).toBe(pts[0]);
        expect(out.at(-1)).toBe(pts.at(-1));
        for (let i = 1; i < out.length; i++) expect(out[i]!.t).toBeGreaterThan(out[i - 1]!.t);
        const min = Math.min(...ys);
        const max = Math.max(...ys);
        expect(out.some((p) => p.y === min)).toBe(true);
        expect(out.some((p) => p.y === max)).toBe(true);
      }),
    );
  });

  it('100 000 points → at most 2 000, keeping a one-sample spike', () => {
    const pts = Array.from({ length: 100_000 }, (_, i) => ({ t: i, w: i === 54_321 ? 99 : 10 }));
    const out = downsample(pts, (p) => p.w);
    expect(out.length).toBeLessThanOrEqual(2000);
    const wavy = Array.from({ length: 100_000 }, (_, i) => ({ t: i, w: Math.sin(i / 500) }));
    expect(downsample(wavy, (p) => p.w)).toHaveLength(2000);
    expect(out).toContain(pts[54_321]);
  });
});

describe('encodeSeries edge cases found by the property test', () => {
  // fast-check counterexample (seed -901745983): a column of zeros holding one -0 came back as +0.
  it('keeps -0 in a column of whole numbers', () => {
    const samples = [0, 1, 2, 3, 4].map((t, i) => ({ t, volts: i === 1 ? -0 : 0 }));
    const decoded = decodeSeries(encodeSeries(samples));
    expect(decoded.ok).toBe(true);
    if (decoded.ok) expect(Object.is(decoded.samples[1]!.volts, -0)).toBe(true);
  });
});

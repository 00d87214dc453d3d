import { describe, it } from 'vitest';
import fc from 'fast-check';
import {
  airlineBand,
  beamDistanceM,
  candelaFromLux,
  chargeToWh,
  combinedLossFraction,
  expectedDailyWh,
  paretoFront,
} from '@/lib/measure';
import { finiteOrMeasureError } from './helpers';

// Contract (issue 3): every function throws MeasureError for non-finite inputs or results and never
// returns NaN or ±Infinity. The series functions, convert, powerBudget, summarize and valueRatios are
// covered in their own files; this file covers the scalar ones with any double, NaN and ±Infinity included.
describe('scalar functions never return NaN or ±Infinity', () => {
  const any = fc.double();
  const opts = { numRuns: 300 };

  it('beamDistanceM, candelaFromLux, airlineBand', () => {
    fc.assert(fc.property(any, (x) => finiteOrMeasureError(() => beamDistanceM(x))), opts);
    fc.assert(fc.property(any, any, (e, d) => finiteOrMeasureError(() => candelaFromLux(e, d))), opts);
    fc.assert(fc.property(any, (x) => finiteOrMeasureError(() => airlineBand(x))), opts);
  });

  it('chargeToWh', () => {
    const unit = fc.constantFrom('mAh', 'Ah') as fc.Arbitrary<'mAh' | 'Ah'>;
    fc.assert(fc.property(any, unit, any, (c, u, v) => finiteOrMeasureError(() => chargeToWh(c, u, v))), opts);
  });

  it('combinedLossFraction, expectedDailyWh', () => {
    fc.assert(fc.property(fc.array(any, { maxLength: 6 }), (ls) => finiteOrMeasureError(() => combinedLossFraction(ls))), opts);
    fc.assert(fc.property(any, any, any, (w, h, l) => finiteOrMeasureError(() => expectedDailyWh(w, h, l))), opts);
  });

  it('paretoFront returns only input items and throws MeasureError for non-finite values', () => {
    const v = fc.oneof(any, fc.constant(null));
    fc.assert(
      fc.property(fc.array(fc.record({ x: v, y: v }), { maxLength: 10 }), (pts) =>
        finiteOrMeasureError(() => paretoFront(pts, (p) => p.x, (p) => p.y, { x: 'min', y: 'max' }).length),
      ),
      opts,
    );
  });
});

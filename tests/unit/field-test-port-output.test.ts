import { describe, expect, it } from 'vitest';
import { analyzeFieldTest, analyzeTrial } from '@/lib/field-tests/analysis';
import { measuredFor, measuredPortFigures, parsePortFigureKey, portOutputMismatch, portOutputReading } from '@/lib/field-tests/port-output';
import { typedKeysFor, typedTrialSchema } from '@/lib/field-tests/schemas';
import type { Port } from '@/lib/measure';

/*
 * Port-output trials: P = V × I (definition of electric power; SI brochure, 9th ed., derived unit watt = V·A).
 * USB PD Standard Power Range levels, check-values §7: 9 V at 3 A = 27 W, 20 V at 3 A = 60 W.
 */
const bankPorts: Port[] = [
  { kind: 'usb-c', direction: 'output', pdProfiles: [{ volts: 5, amps: 3 }, { volts: 9, amps: 3 }] },
  { kind: 'usb-c', direction: 'input', pdProfiles: [{ volts: 9, amps: 2 }] },
  { kind: 'usb-a', direction: 'both', volts: 5, amps: 2.4 },
];

describe('port-output readings', () => {
  it('a USB meter on the 9 V profile: 9.02 V × 2.95 A = 26.609 W (just under the 27 W SPR level)', () => {
    const r = portOutputReading({ portNumber: 1, portVolts: 9.02, portAmps: 2.95, loadAmps: 3 });
    expect(r).toMatchObject({ portNumber: 1, volts: 9.02, amps: 2.95, loadAmps: 3 });
    expect(r.watts).toBeCloseTo(26.609, 12);
  });

  it('refuses missing, fractional, out-of-range and unknown values with the figure named', () => {
    expect(() => portOutputReading({ portVolts: 5, portAmps: 1 })).toThrow(/port number/);
    expect(() => portOutputReading({ portNumber: 1.5, portVolts: 5, portAmps: 1 })).toThrow(/whole number/);
    expect(() => portOutputReading({ portNumber: 1, portVolts: 0, portAmps: 1 })).toThrow(/voltage/);
    expect(() => portOutputReading({ portNumber: 1, portVolts: 5, portAmps: 500 })).toThrow(/current/);
    expect(() => portOutputReading({ portNumber: 1, portVolts: 5, portAmps: 1, mass: 3 })).toThrow(/does not record mass/);
  });

  it('the port must be one of the item’s outputs (or both ways)', () => {
    expect(portOutputMismatch('Bank', bankPorts, 1)).toBeNull();
    expect(portOutputMismatch('Bank', bankPorts, 3)).toBeNull(); // 'both'
    expect(portOutputMismatch('Bank', bankPorts, 2)).toBe('Port 2 of “Bank” is an input (USB-C input); a port output test measures an output.');
    expect(portOutputMismatch('Bank', bankPorts, 4)).toBe('“Bank” lists 3 ports; there is no port 4. Use the number in the Ports table on its page.');
    expect(portOutputMismatch('Lamp', [], 1)).toMatch(/lists no ports yet/);
  });

  it('the typed-trial schema and the kind’s keys accept the port keys only for this kind', () => {
    expect(typedKeysFor('port-output')).toEqual(['portNumber', 'portVolts', 'portAmps', 'loadAmps']);
    expect(typedTrialSchema.safeParse({ item: 'x', typedValues: { portNumber: 1, portVolts: 5, portAmps: 2 } }).success).toBe(true);
    expect(typedTrialSchema.safeParse({ item: 'x', typedValues: { portNumbr: 1 } }).success).toBe(false);
  });
});

describe('port-output analysis', () => {
  it('gives per-port figures, and a bad reading as an error, not a throw', () => {
    const ok = analyzeTrial('port-output', { itemId: 'bank', typed: { portNumber: 3, portVolts: 5.1, portAmps: 2 } });
    expect(ok.ok).toBe(true);
    if (ok.ok) {
      // 5.1 V × 2 A = 10.2 W
      expect(ok.figures.map((f) => [f.key, f.unit])).toEqual([['port3Watts', 'W'], ['port3Volts', 'V'], ['port3Amps', 'A']]);
      expect(ok.figures[0]!.value).toBeCloseTo(10.2, 12);
    }
    const bad = analyzeTrial('port-output', { itemId: 'bank', typed: { portNumber: 3, portVolts: 5.1 } });
    expect(bad.ok).toBe(false);
  });

  it('two trials of port 1 and one of port 3 stay apart; watts are the mean of each V × I', () => {
    const a = analyzeFieldTest('port-output', [
      { itemId: 'bank', typed: { portNumber: 1, portVolts: 9.02, portAmps: 2.95 } }, // 26.609 W
      { itemId: 'bank', typed: { portNumber: 1, portVolts: 8.98, portAmps: 3.01 } }, // 27.0298 W
      { itemId: 'bank', typed: { portNumber: 3, portVolts: 5.1, portAmps: 2 } }, // 10.2 W
    ]);
    const figures = measuredPortFigures(a.items[0]!.summaries);
    expect(figures.map((f) => [f.portNumber, f.n])).toEqual([[1, 2], [3, 1]]);
    expect(figures[0]!.volts).toBeCloseTo(9.0, 12); // (9.02 + 8.98) / 2
    expect(figures[0]!.amps).toBeCloseTo(2.98, 12); // (2.95 + 3.01) / 2
    expect(figures[0]!.watts).toBeCloseTo(26.8194, 12); // (26.609 + 27.0298) / 2, not 9.00 × 2.98 = 26.82
    expect(figures[1]!.watts).toBeCloseTo(10.2, 12);
  });

  it('figure keys parse back to their port', () => {
    expect(parsePortFigureKey('port12Watts')).toEqual({ portNumber: 12, quantity: 'Watts' });
    expect(parsePortFigureKey('mass')).toBeNull();
  });

  it('a measurement belongs beside the claimed port only while that port is unchanged', () => {
    const m = [{ position: 0, kind: 'usb-c', direction: 'output', label: null, watts: 26.8 }];
    expect(measuredFor(bankPorts[0]!, 0, m)?.watts).toBe(26.8);
    expect(measuredFor(bankPorts[2]!, 0, m)).toBeUndefined(); // another kind at that position now
    expect(measuredFor({ ...bankPorts[0]!, label: 'USB-C 1' }, 0, m)).toBeUndefined();
  });
});

import { describe, expect, it } from 'vitest';
import { portMostWatts, portsGroup, withPorts, type ComparePort } from '@/lib/compare/ports';
import type { CompareResponse } from '@/lib/browse/contract';

/*
 * Ports rows of the side-by-side. Power P = V × I; USB PD levels from check-values §7 (SPR 3 A: 5 V 15 W,
 * 9 V 27 W, 15 V 45 W, 20 V 60 W; 20 V × 2.25 A = 45 W is a common 45 W charger level).
 */
const claimed = (p: Omit<ComparePort, 'number' | 'basis' | 'provenance'>, number: number): ComparePort => ({ ...p, number, basis: 'claimed', provenance: null });
const PD_45 = [{ volts: 5, amps: 3 }, { volts: 9, amps: 3 }, { volts: 15, amps: 3 }, { volts: 20, amps: 2.25 }];

const bankA: ComparePort[] = [
  claimed({ kind: 'usb-c', direction: 'output', watts: 45, pdProfiles: PD_45 }, 1),
  { kind: 'usb-c', direction: 'output', number: 1, basis: 'measured', provenance: '/field-tests/t1', volts: 19.82, amps: 2.225, watts: 44.0992 },
  claimed({ kind: 'usb-c', direction: 'input', watts: 45 }, 2),
  claimed({ kind: 'usb-a', direction: 'output', volts: 5, amps: 2.4 }, 3),
];
const bankB: ComparePort[] = [
  claimed({ kind: 'usb-c', direction: 'output', watts: 20, pdProfiles: [{ volts: 5, amps: 3 }, { volts: 9, amps: 2.22 }] }, 1),
  claimed({ kind: 'usb-a', direction: 'output', volts: 5, amps: 2.4, watts: 12 }, 2),
];
const battery: ComparePort[] = [
  claimed({ kind: 'socket-12v', direction: 'output', volts: 12.8, amps: 10 }, 1),
  claimed({ kind: 'solar-input', direction: 'input', voltageWindow: { minVolts: 12, maxVolts: 28 }, watts: 120 }, 2),
];

describe('portMostWatts', () => {
  it('watts, else the best PD level, else nominal volts × amps', () => {
    expect(portMostWatts({ kind: 'usb-c', direction: 'output', watts: 45, pdProfiles: PD_45 })).toBe(45);
    expect(portMostWatts({ kind: 'usb-c', direction: 'output', pdProfiles: PD_45 })).toBe(45); // 15 × 3 = 20 × 2.25 = 45
    expect(portMostWatts({ kind: 'usb-a', direction: 'output', amps: 2.4 })).toBeCloseTo(12, 12); // 5 V (USB default) × 2.4 A
    expect(portMostWatts({ kind: 'socket-12v', direction: 'output', volts: 12.8, amps: 10 })).toBeCloseTo(128, 12);
    expect(portMostWatts({ kind: 'dc-barrel', direction: 'output', amps: 2 })).toBeNull(); // no voltage stated
  });
});

describe('portsGroup', () => {
  const group = portsGroup([bankA, bankB, battery])!;
  const row = (key: string) => group.rows.find((r) => r.key === key)!;
  const values = (key: string) => row(key).cells.map((c) => c.value);
  const best = (key: string) => row(key).cells.map((c) => c.best);

  it('has a row per connector and direction, outputs first, in a fixed order', () => {
    expect(group.rows.map((r) => r.label)).toEqual([
      'USB-A out, most W',
      'USB-C out, most W',
      'USB-C out, measured W',
      'USB-C out, Power Delivery levels',
      '12 V socket out, most W',
      'Solar input window',
      'Solar input, most W',
      'USB-C in, W it takes',
    ]);
  });

  it('marks the most output power best; ties are all best; one figure alone is not marked', () => {
    expect(values('ports:out:usb-c:watts')).toEqual([45, 20, null]);
    expect(best('ports:out:usb-c:watts')).toEqual([true, false, false]);
    expect(values('ports:out:usb-a:watts')).toEqual([12, 12, null]); // 5 × 2.4 = 12 and a stated 12 W
    expect(best('ports:out:usb-a:watts')).toEqual([true, true, false]);
    expect(values('ports:out:socket-12v:watts')).toEqual([null, null, 128]); // 12.8 V × 10 A
    expect(best('ports:out:socket-12v:watts')).toEqual([false, false, false]);
  });

  it('measured figures keep their basis and the test they come from', () => {
    expect(row('ports:out:usb-c:measured-watts').cells[0]).toMatchObject({ value: 44.0992, basis: 'measured', provenance: '/field-tests/t1' });
    expect(row('ports:out:usb-c:watts').cells[0]).toMatchObject({ basis: 'claimed', provenance: null });
  });

  it('PD levels and the solar window read as text; input rows mark nothing', () => {
    expect(values('ports:out:usb-c:pd')).toEqual(['5 / 9 / 15 / 20 V (up to 20 V × 2.25 A)', '5 / 9 V (up to 9 V × 2.22 A)', null]);
    expect(values('ports:in:solar-input:window')).toEqual([null, null, '12–28 V']);
    expect(row('ports:in:usb-c:watts').direction).toBeNull();
    expect(best('ports:in:usb-c:watts')).toEqual([false, false, false]);
  });

  it('no ports, no group; the group goes before the ratios', () => {
    expect(portsGroup([[], []])).toBeNull();
    const response: CompareResponse = { items: [], groups: [{ id: 'specs', label: 'Specs', rows: [] }, { id: 'ratios', label: 'Value ratios', rows: [] }] };
    expect(withPorts(response, [bankA, bankB]).groups.map((g) => g.id)).toEqual(['specs', 'ports', 'ratios']);
    expect(withPorts(response, [[], []])).toBe(response);
  });
});

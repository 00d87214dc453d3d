/**
 * Ports in words and the PD profile text field (lib/gear/ports.ts), the shared schema's port rules
 * (lib/gear/schemas.ts) and the form's round trip (lib/gear/form-values.ts).
 * USB PD figures: Standard Power Range fixed profiles 5, 9, 15, 20 V at up to 3 A (5 A with a 5 A
 * cable), Extended Power Range up to 48 V (USB PD Rev 3.1) — ../shared/reference/check-values.md §7.
 */
import { describe, expect, it } from 'vitest';
import { describePort, formatPdProfiles, parsePdProfiles, PdProfileTextError, tryParsePdProfiles } from '@/lib/gear/ports';
import { gearInputSchema, portClaims } from '@/lib/gear/schemas';
import { clean, emptyGearValues, emptyPortRow, toFormValues } from '@/lib/gear/form-values';

describe('parsePdProfiles', () => {
  it('reads the usual ways of writing profiles', () => {
    expect(parsePdProfiles('5 V 3 A · 9 V 3 A · 15 V 3 A · 20 V 3.25 A')).toEqual([
      { volts: 5, amps: 3 },
      { volts: 9, amps: 3 },
      { volts: 15, amps: 3 },
      { volts: 20, amps: 3.25 },
    ]);
    expect(parsePdProfiles('9V3A, 15v/3a; 20 V @ 2.25 A + 12 V x 1.5 A')).toEqual([
      { volts: 9, amps: 3 },
      { volts: 15, amps: 3 },
      { volts: 20, amps: 2.25 },
      { volts: 12, amps: 1.5 },
    ]);
    expect(parsePdProfiles('  ')).toEqual([]);
  });

  it('names the piece it cannot read', () => {
    expect(() => parsePdProfiles('5 V 3 A, 9 volts')).toThrow(PdProfileTextError);
    expect(() => parsePdProfiles('5 V 3 A, 9 volts')).toThrow('Could not read "9 volts"');
    expect(() => parsePdProfiles('3 A 5 V')).toThrow('Could not read "3 A 5 V"');
    expect(tryParsePdProfiles('20 W')).toEqual({ ok: false, message: 'Could not read "20 W": write each profile as volts and amps, e.g. "9 V 3 A".' });
  });

  it('formats back to the text it reads', () => {
    const text = '5 V 3 A · 9 V 3 A · 15 V 3 A · 20 V 3.25 A';
    expect(formatPdProfiles(parsePdProfiles(text))).toBe(text);
  });
});

describe('describePort', () => {
  it('puts a port in words for the history', () => {
    expect(describePort({ kind: 'usb-c', direction: 'output', watts: 60, pdProfiles: [{ volts: 5, amps: 3 }, { volts: 20, amps: 3 }] })).toBe('USB-C output: 60 W; PD 5 V 3 A · 20 V 3 A');
    expect(describePort({ kind: 'genderless-dc', direction: 'input', volts: 13.8, amps: 6, voltageWindow: { minVolts: 11.7, maxVolts: 15.2 }, label: 'fused lead' })).toBe(
      'genderless DC connector input: 13.8 V, 6 A; accepts 11.7–15.2 V; fused lead',
    );
    expect(describePort({ kind: 'other', direction: 'both', label: '2-pin trailer plug' })).toBe('2-pin trailer plug input and output');
    expect(describePort({ kind: 'usb-a', direction: 'output', volts: 5, amps: 2.4, efficiency: 0.9 })).toBe('USB-A output: 5 V, 2.4 A; 90 % efficient');
  });
});

describe('ports in the shared schema', () => {
  const base = { category: 'power-bank', name: 'Bank', maker: 'Voltmoth', chemistry: 'li-ion', specs: { mass: { value: '300 g' }, ratedEnergy: { value: '72 Wh' } } };

  it('accepts figures typed with or without their unit and gives claimed ports with the item’s source', () => {
    const data = gearInputSchema.parse({ ...base, claimSource: 'manual', ports: [{ kind: 'usb-a', direction: 'output', volts: '5 V', amps: '2.4', watts: 12 }] });
    expect(portClaims(data)).toEqual([{ kind: 'usb-a', direction: 'output', volts: 5, amps: 2.4, watts: 12, source: 'manual' }]);
  });

  it('refuses a volts figure typed with the wrong unit, naming the field', () => {
    const result = gearInputSchema.safeParse({ ...base, ports: [{ kind: 'usb-a', direction: 'output', volts: '5 A' }] });
    expect(result.success).toBe(false);
    expect(result.error!.issues.map((i) => i.path.join('.'))).toEqual(['ports.0.volts']);
  });

  it('accepts the 48 V / 5 A EPR ceiling and refuses above it', () => {
    expect(gearInputSchema.safeParse({ ...base, ports: [{ kind: 'usb-c', direction: 'output', pdProfiles: [{ volts: 48, amps: 5 }] }] }).success).toBe(true);
    const over = gearInputSchema.safeParse({ ...base, ports: [{ kind: 'usb-c', direction: 'output', pdProfiles: '48.5 V 5 A' }] });
    expect(over.error!.issues.map((i) => i.path.join('.'))).toEqual(['ports.0.pdProfiles.0.volts']);
  });
});

describe('the form’s port rows', () => {
  it('keep only what the connector and direction record, and round-trip through the working copy input', () => {
    const values = { ...emptyGearValues('power-bank'), name: 'Bank', maker: 'Voltmoth' };
    values.ports = [
      { ...emptyPortRow(), kind: 'usb-a', direction: 'output', volts: '5', amps: '2.4', pdProfiles: '9 V 2 A', minVolts: '4', maxVolts: '6' },
      { ...emptyPortRow(), kind: 'usb-c', direction: 'input', watts: '30', pdProfiles: '5 V 3 A · 9 V 3 A', minVolts: '5', maxVolts: '20', source: 'manual' },
    ];
    const cleaned = clean(values, true) as { ports: Record<string, unknown>[] };
    // PD text dropped for USB-A, window dropped for an output.
    expect(cleaned.ports[0]).toEqual({ kind: 'usb-a', direction: 'output', volts: '5', amps: '2.4', watts: '' });
    expect(cleaned.ports[1]).toMatchObject({ pdProfiles: '5 V 3 A · 9 V 3 A', voltageWindow: { minVolts: '5', maxVolts: '20' }, source: 'manual' });

    const data = gearInputSchema.parse({ ...cleaned, chemistry: 'li-ion', specs: { mass: { value: '300 g' }, ratedEnergy: { value: '72 Wh' } } });
    const input = { claimSource: 'packaging', ports: portClaims(data) };
    const back = toFormValues(input, 'power-bank').ports;
    expect(back[1]).toEqual({ ...emptyPortRow(), kind: 'usb-c', direction: 'input', watts: '30', pdProfiles: '5 V 3 A · 9 V 3 A', minVolts: '5', maxVolts: '20', source: 'manual' });
    expect(back[0]).toEqual({ ...emptyPortRow(), kind: 'usb-a', direction: 'output', volts: '5', amps: '2.4' });
  });
});

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { pdProfileSatisfies, portFits, validatePort, connectorsJoin, type PdProfile, type Port } from '@/lib/measure';
import { expectCode } from './measure/helpers';

// USB Power Delivery fixed levels (check-values §7, USB PD, Standard Power Range at 3 A and
// Extended Power Range of USB PD Revision 3.1, May 2021): 5 V → 15 W, 9 V → 27 W, 15 V → 45 W,
// 20 V → 60 W at 3 A; 20 V at 5 A (100 W) needs a 5 A cable; 28 V → 140 W, 36 V → 180 W,
// 48 V → 240 W at 5 A.
const SPR_3A: PdProfile[] = [
  { volts: 5, amps: 3 },
  { volts: 9, amps: 3 },
  { volts: 15, amps: 3 },
  { volts: 20, amps: 3 },
];
const EPR_5A: PdProfile[] = [
  { volts: 28, amps: 5 },
  { volts: 36, amps: 5 },
  { volts: 48, amps: 5 },
];
const usbC = (direction: Port['direction'], pdProfiles?: PdProfile[], extra: Partial<Port> = {}): Port => ({
  kind: 'usb-c',
  direction,
  ...(pdProfiles ? { pdProfiles } : {}),
  ...extra,
});

describe('pdProfileSatisfies against the USB PD power levels (check-values §7)', () => {
  const charger60W = usbC('output', SPR_3A);

  it('the profile table has the published wattages (V × A)', () => {
    // USB PD SPR at 3 A: 15, 27, 45, 60 W; EPR (PD Rev 3.1) at 5 A: 140, 180, 240 W.
    expect(SPR_3A.map((p) => p.volts * p.amps)).toEqual([15, 27, 45, 60]);
    expect(EPR_5A.map((p) => p.volts * p.amps)).toEqual([140, 180, 240]);
    expect(20 * 5).toBe(100); // the 20 V / 5 A level
  });

  it('a 60 W SPR source meets each SPR level and any lower current at that voltage', () => {
    for (const p of SPR_3A) {
      expect(pdProfileSatisfies(charger60W, p), `${p.volts} V ${p.amps} A`).toBe(true);
      expect(pdProfileSatisfies(charger60W, { volts: p.volts, amps: 1.5 })).toBe(true);
    }
    // A 45 W laptop: 20 V at 2.25 A (45 / 20 = 2.25), within the 20 V / 3 A level.
    expect(pdProfileSatisfies(charger60W, { volts: 20, amps: 2.25 })).toBe(true);
  });

  it('a 60 W SPR source does not give 20 V at 5 A (the 100 W level) nor any EPR voltage', () => {
    expect(pdProfileSatisfies(charger60W, { volts: 20, amps: 5 })).toBe(false);
    for (const p of EPR_5A) expect(pdProfileSatisfies(charger60W, p)).toBe(false);
  });

  it('a voltage that is not offered is not met, even at a lower current (fixed profiles match by voltage)', () => {
    expect(pdProfileSatisfies(charger60W, { volts: 12, amps: 1 })).toBe(false);
    expect(pdProfileSatisfies(usbC('output', [{ volts: 5, amps: 3 }]), { volts: 9, amps: 0.5 })).toBe(false);
  });

  it('a 100 W source (20 V at 5 A) and a 240 W EPR source (48 V at 5 A)', () => {
    const s100 = usbC('output', [...SPR_3A.slice(0, 3), { volts: 20, amps: 5 }]);
    expect(pdProfileSatisfies(s100, { volts: 20, amps: 5 })).toBe(true);
    const s240 = usbC('output', [...SPR_3A, { volts: 20, amps: 5 }, ...EPR_5A]);
    expect(pdProfileSatisfies(s240, { volts: 48, amps: 5 })).toBe(true); // 240 W
    expect(pdProfileSatisfies(s240, { volts: 28, amps: 5 })).toBe(true); // 140 W
  });

  it('a port without PD profiles offers no fixed profile', () => {
    expect(pdProfileSatisfies(usbC('output', undefined, { amps: 3 }), { volts: 5, amps: 1 })).toBe(false);
  });

  it('rejects profiles beyond PD: above 48 V or 5 A (PD Rev 3.1 EPR, check-values §7)', () => {
    expectCode(() => pdProfileSatisfies(charger60W, { volts: 49, amps: 1 }), 'out-of-range');
    expectCode(() => pdProfileSatisfies(charger60W, { volts: 20, amps: 5.1 }), 'out-of-range');
    expectCode(() => validatePort(usbC('output', [{ volts: 20, amps: 6 }])), 'out-of-range');
    expectCode(() => pdProfileSatisfies(usbC('input', SPR_3A), { volts: 5, amps: 1 }), 'out-of-range');
    expectCode(() => pdProfileSatisfies(charger60W, { volts: Number.NaN, amps: 1 }), 'not-finite');
  });

  it('property: meeting a need implies meeting any smaller current at the same voltage; adding a profile never un-meets', () => {
    const volts = fc.constantFrom(5, 9, 12, 15, 20, 28, 36, 48);
    const amps = fc.integer({ min: 1, max: 500 }).map((c) => c / 100);
    const profile = fc.record({ volts, amps });
    fc.assert(
      fc.property(fc.array(profile, { minLength: 1, maxLength: 7 }), profile, profile, fc.double({ min: 0.01, max: 1, noNaN: true }), (ps, need, extra, share) => {
        const src = usbC('output', ps);
        const met = pdProfileSatisfies(src, need);
        if (met) expect(pdProfileSatisfies(src, { volts: need.volts, amps: Math.max(0.01, need.amps * share) })).toBe(true);
        if (met) expect(pdProfileSatisfies(usbC('output', [...ps, extra]), need)).toBe(true);
        // Same answer as portFits for a PD sink that needs exactly this profile (no watts cap on the source).
        expect(portFits(src, usbC('input', [need])).fits).toBe(met);
      }),
      { numRuns: 300 },
    );
  });
});

describe('portFits', () => {
  it('the issue 9 example: a 45 W laptop on a bank that offers at most 9 V', () => {
    const bank = usbC('output', [
      { volts: 5, amps: 3 },
      { volts: 9, amps: 2 },
    ]);
    const laptop = usbC('input', [{ volts: 20, amps: 2.25 }]);
    const fit = portFits(bank, laptop, { output: 'the bank', input: 'the laptop' });
    expect(fit).toEqual({
      fits: false,
      problem: 'voltage',
      reasons: ['the laptop needs 20 V at 2.25 A over USB-C; the bank offers at most 9 V at 2 A'],
      cautions: [],
    });
  });

  it('a PD sink with alternatives fits when any one is offered; a 5 A profile asks for a 5 A cable', () => {
    const laptop = usbC('input', [
      { volts: 20, amps: 5 },
      { volts: 15, amps: 3 },
    ]);
    expect(portFits(usbC('output', SPR_3A), laptop).fits).toBe(true); // 15 V at 3 A is offered
    const fit = portFits(usbC('output', [{ volts: 20, amps: 5 }]), usbC('input', [{ volts: 20, amps: 5 }]));
    expect(fit.fits).toBe(true);
    // USB PD: the 20 V / 5 A (100 W) level needs a 5 A cable (check-values §7).
    expect(fit.cautions.join(' ')).toMatch(/rated for 5 A/);
  });

  it("a port's watts limit caps every profile (45 W ÷ 20 V = 2.25 A)", () => {
    const capped = usbC('output', SPR_3A, { watts: 45 });
    expect(portFits(capped, usbC('input', [{ volts: 20, amps: 2.25 }])).fits).toBe(true);
    expect(portFits(capped, usbC('input', [{ volts: 20, amps: 3 }])).fits).toBe(false);
  });

  it('plain USB: 5 V, current from the port (USB 2.0 500 mA, BC 1.2 1.5 A; check-values §7)', () => {
    const usb2: Port = { kind: 'usb-a', direction: 'output', amps: 0.5 };
    const bc12: Port = { kind: 'usb-a', direction: 'output', amps: 1.5 };
    const lantern: Port = { kind: 'usb-a', direction: 'input', amps: 1 };
    expect(portFits(bc12, lantern).fits).toBe(true);
    expect(portFits(usb2, lantern, { output: 'the hub', input: 'the lantern' })).toEqual({
      fits: false,
      problem: 'current',
      reasons: ['the lantern needs 5 V at 1 A; the hub delivers at most 0.5 A'],
      cautions: [],
    });
    // Power instead of current: 7.5 W at 5 V = 1.5 A, exactly the BC 1.2 level.
    expect(portFits(bc12, { kind: 'usb-a', direction: 'input', watts: 7.5 }).fits).toBe(true);
    expect(portFits(bc12, { kind: 'usb-a', direction: 'input', watts: 7.6 }).fits).toBe(false);
  });

  it('a USB-C sink without PD profiles gets only 5 V from a PD source, whatever window it states', () => {
    // Nothing negotiates a higher voltage without PD. 10 W ÷ 5 V = 2 A ≤ 3 A fits; 20 W ÷ 5 V = 4 A > 3 A does not.
    const sink = (watts: number): Port => ({ kind: 'usb-c', direction: 'input', voltageWindow: { minVolts: 5, maxVolts: 12 }, watts });
    expect(portFits(usbC('output', SPR_3A), sink(10)).fits).toBe(true);
    expect(portFits(usbC('output', SPR_3A), sink(20), { output: 'the bank', input: 'the fan' }).reasons).toEqual([
      'the fan needs 5 V at 4 A; the bank delivers at most 3 A',
    ]);
  });

  it('a USB-C sink without PD profiles takes 5 V from a PD source', () => {
    const phone = usbC('input', undefined, { amps: 2 });
    expect(portFits(usbC('output', SPR_3A), phone).fits).toBe(true);
  });

  it("12 V: a radio's supply window, a battery's nominal voltage and the ±10 % convention", () => {
    // 13.8 V ± 15 % = 11.73 to 15.87 V: one radio's stated supply range (check-values §8, [S]).
    const radio: Port = { kind: 'socket-12v', direction: 'input', voltageWindow: { minVolts: 11.73, maxVolts: 15.87 }, amps: 2 };
    const socket: Port = { kind: 'socket-12v', direction: 'output', amps: 10 }; // 12 V by the kind's convention
    expect(portFits(socket, radio).fits).toBe(true);
    expect(portFits({ ...socket, volts: 24 }, radio, { output: 'the truck socket', input: 'the radio' }).reasons).toEqual([
      'the radio needs 11.73–15.87 V at its 12 V socket; the truck socket gives 24 V',
    ]);
    // LiFePO4 4S: 4 × 3.2 V = 12.8 V (check-values §4); within 10 % of 12 V (our own convention, no source).
    const posts: Port = { kind: 'binding-posts', direction: 'output', volts: 12.8, amps: 50 };
    const fridge: Port = { kind: 'binding-posts', direction: 'input', volts: 12, amps: 4 };
    expect(portFits(posts, fridge).fits).toBe(true);
    expect(portFits({ ...posts, volts: 13.3 }, fridge).fits).toBe(false); // 13.3 − 12 = 1.3 V > 1.2 V
  });

  it('solar input: window check, any panel lead with a caution about the plug', () => {
    const solarIn: Port = { kind: 'solar-input', direction: 'input', voltageWindow: { minVolts: 12, maxVolts: 28 } };
    const panel: Port = { kind: 'dc-barrel', direction: 'output', volts: 18, watts: 100 };
    const fit = portFits(panel, solarIn);
    expect(fit.fits).toBe(true);
    expect(fit.cautions.some((c) => /plug/.test(c))).toBe(true);
    expect(portFits({ ...panel, volts: 36 }, solarIn).problem).toBe('voltage');
    // The input's 10 A / 120 W is the most its controller takes, not a need: a 3.33 A panel still charges (slower).
    expect(portFits({ ...panel, amps: 3.33, watts: 60 }, { ...solarIn, amps: 10, watts: 120 }).fits).toBe(true);
    expect(portFits({ kind: 'usb-c', direction: 'output' }, solarIn).problem).toBe('connector');
  });

  it('connectors: different kinds do not join; other ports join by label; mains is never fed', () => {
    const socket: Port = { kind: 'socket-12v', direction: 'output' };
    const genderless: Port = { kind: 'genderless-dc', direction: 'input', volts: 12 };
    expect(portFits(socket, genderless, { output: 'the battery', input: 'the radio' })).toMatchObject({
      fits: false,
      problem: 'connector',
      reasons: ["the battery's 12 V socket does not join the radio's genderless DC connector directly"],
    });
    expect(connectorsJoin({ kind: 'other', direction: 'output', label: 'XT60' }, { kind: 'other', direction: 'input', label: 'xt60' })).toBe(true);
    expect(connectorsJoin({ kind: 'other', direction: 'output', label: 'XT60' }, { kind: 'other', direction: 'input', label: 'XT90' })).toBe(false);
    expect(portFits(socket, { kind: 'mains-input', direction: 'input' }).problem).toBe('connector');
  });

  it('directions, unstated voltages and currents', () => {
    const out: Port = { kind: 'dc-barrel', direction: 'output', volts: 12 };
    expect(portFits({ ...out, direction: 'input' }, { kind: 'dc-barrel', direction: 'input', volts: 12 }).problem).toBe('direction');
    expect(portFits({ kind: 'dc-barrel', direction: 'output' }, { kind: 'dc-barrel', direction: 'input', volts: 12 }).problem).toBe('voltage');
    expect(portFits(out, { kind: 'dc-barrel', direction: 'input' }).problem).toBe('voltage');
    const unstated = portFits(out, { kind: 'dc-barrel', direction: 'input', volts: 12, amps: 1 });
    expect(unstated.fits).toBe(true);
    expect(unstated.cautions.join(' ')).toMatch(/does not state the current/);
  });

  it('validatePort rejects bad ports with clear codes and keeps only known fields', () => {
    expectCode(() => validatePort(null), 'out-of-range');
    expectCode(() => validatePort({ kind: 'usb-d', direction: 'output' }), 'out-of-range');
    expectCode(() => validatePort({ kind: 'usb-a', direction: 'sideways' }), 'out-of-range');
    expectCode(() => validatePort({ kind: 'usb-a', direction: 'output', pdProfiles: SPR_3A }), 'out-of-range');
    expectCode(() => validatePort({ kind: 'usb-c', direction: 'output', pdProfiles: [] }), 'out-of-range');
    expectCode(() => validatePort({ kind: 'mains-input', direction: 'output' }), 'out-of-range');
    expectCode(() => validatePort({ kind: 'other', direction: 'output' }), 'out-of-range');
    expectCode(() => validatePort({ kind: 'dc-barrel', direction: 'output', voltageWindow: { minVolts: 5, maxVolts: 6 } }), 'out-of-range');
    expectCode(() => validatePort({ kind: 'solar-input', direction: 'input', voltageWindow: { minVolts: 20, maxVolts: 12 } }), 'out-of-range');
    expectCode(() => validatePort({ kind: 'dc-barrel', direction: 'output', volts: -12 }), 'out-of-range');
    expectCode(() => validatePort({ kind: 'dc-barrel', direction: 'output', amps: Number.POSITIVE_INFINITY }), 'not-finite');
    expectCode(() => validatePort({ kind: 'dc-barrel', direction: 'output', efficiency: 1.2 }), 'out-of-range');
    const clean = validatePort(JSON.parse('{"kind":"usb-a","direction":"output","amps":2,"__proto__":{"polluted":1},"extra":true}'));
    expect(clean).toEqual({ kind: 'usb-a', direction: 'output', amps: 2 });
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });

  it('never throws anything but MeasureError on arbitrary JSON', () => {
    fc.assert(
      fc.property(fc.jsonValue(), fc.jsonValue(), (a, b) => {
        try {
          const r = portFits(a as unknown as Port, b as unknown as Port);
          expect(typeof r.fits).toBe('boolean');
        } catch (e) {
          expect((e as Error).name).toBe('MeasureError');
        }
      }),
      { numRuns: 300 },
    );
  });
});

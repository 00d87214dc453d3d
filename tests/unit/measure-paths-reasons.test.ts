import { describe, expect, it } from 'vitest';
import { findChargingPaths, type KitPowerItem } from '@/lib/measure';

/*
 * Every distinct reason a device has no charging path (issue 9: "or says plainly why there is none"),
 * not only the first problem met. Hand-worked kits; the arithmetic of each misfit is in the comments.
 * USB PD levels: check-values §7 (SPR at 3 A: 5 V 15 W, 9 V 27 W, 15 V 45 W, 20 V 60 W; Type-C Current
 * @1.5 A 7.5 W, @3.0 A 15 W). The radio's supply window 13.8 V ± 15 % = 11.73–15.87 V: check-values §8 [S].
 */

const reasonsOf = (items: KitPowerItem[], id: string) => {
  const d = findChargingPaths({ items }).devices.find((x) => x.itemId === id);
  if (!d) throw new Error(`no device ${id}`);
  return d;
};

/** The demo base camp in miniature: an 18 V panel on a genderless lead, a LiFePO4 battery with posts and a socket. */
const panel: KitPowerItem = { id: 'panel', name: 'Panel', role: 'source', ports: [{ kind: 'genderless-dc', direction: 'output', volts: 18, amps: 3.33, watts: 60 }] };
const extension: KitPowerItem = { id: 'ext', name: 'Extension lead', role: 'cable', from: { kind: 'genderless-dc', amps: 30 }, to: { kind: 'genderless-dc', amps: 30 } };
const battery: KitPowerItem = {
  id: 'battery',
  name: 'Battery',
  role: 'storage',
  ports: [
    { kind: 'binding-posts', direction: 'both', volts: 12.8, amps: 20 },
    { kind: 'socket-12v', direction: 'output', volts: 12.8, amps: 10 },
    { kind: 'solar-input', direction: 'input', voltageWindow: { minVolts: 12, maxVolts: 28 }, efficiency: 0.95 },
  ],
};
const radio: KitPowerItem = {
  id: 'radio',
  name: 'Radio',
  role: 'device',
  ports: [{ kind: 'genderless-dc', direction: 'input', amps: 6, voltageWindow: { minVolts: 11.73, maxVolts: 15.87 } }],
};

describe('findChargingPaths: every distinct reason', () => {
  it('the radio: the panel’s 18 V is too high AND no lead joins the battery to the radio', () => {
    const d = reasonsOf([panel, extension, battery, radio], 'radio');
    expect(d.paths).toEqual([]);
    expect(d.reasons).toEqual([
      // 18 V > 15.87 V, the top of the radio's window (directly, and again through the extension lead: said once).
      'Radio needs 11.73–15.87 V at its genderless DC connector; Panel gives 18 V',
      // The battery's 12.8 V would suit (11.73 ≤ 12.8 ≤ 15.87) but neither of its outputs has a genderless connector.
      "no cable or adapter in the kit joins Battery's binding posts or 12 V socket to Radio's genderless DC connector",
    ]);
  });

  it('adding the missing lead leaves no reason: panel → battery (0.95) → lead (0.98) → radio', () => {
    const lead: KitPowerItem = { id: 'lead', name: 'Socket lead', role: 'cable', from: { kind: 'socket-12v', amps: 10 }, to: { kind: 'genderless-dc', amps: 10 }, efficiency: 0.98 };
    const d = reasonsOf([panel, extension, battery, radio, lead], 'radio');
    expect(d.reasons).toEqual([]);
    // Best path: the panel charges the battery: 1 × 0.95 × 1 × 0.98 × 1 = 0.931.
    expect(d.paths[0]!.efficiency).toBeCloseTo(0.931, 12);
  });

  it('the laptop: the bank’s PD profiles fall short AND nothing joins the battery’s socket to USB-C', () => {
    const bank: KitPowerItem = {
      id: 'bank',
      name: 'Bank',
      role: 'storage',
      // A 20 W bank: 5 V 3 A (15 W) and 9 V 2 A (18 W); no 20 V level.
      ports: [{ kind: 'usb-c', direction: 'output', pdProfiles: [{ volts: 5, amps: 3 }, { volts: 9, amps: 2 }] }],
    };
    const laptop: KitPowerItem = { id: 'laptop', name: 'Laptop', role: 'device', ports: [{ kind: 'usb-c', direction: 'input', pdProfiles: [{ volts: 20, amps: 2.25 }] }] };
    const socketOnly: KitPowerItem = { ...battery, ports: [battery.ports![1]!] };
    const d = reasonsOf([bank, socketOnly, laptop], 'laptop');
    expect(d.reasons).toEqual([
      // Needs 20 V × 2.25 A = 45 W (the 15 V 3 A SPR level's power, at 20 V); the bank's top profile is 9 V × 2 A = 18 W.
      'Laptop needs 20 V at 2.25 A over USB-C; Bank offers at most 9 V at 2 A',
      // 12.8 V from a 12 V socket is no USB PD level at all: a cable alone cannot help, a converting adapter can.
      "Battery's 12 V socket gives 12.8 V; Laptop needs 20 V at 2.25 A over USB-C: that takes an adapter that converts the voltage, not just a cable",
    ]);
  });

  it('a 5 V USB source and a 13.8 V radio: the voltage is the reason, not a missing cable', () => {
    const lanternBank: KitPowerItem = { id: 'lantern', name: 'Lantern', role: 'storage', ports: [{ kind: 'usb-a', direction: 'output', volts: 5, amps: 1 }] };
    const d = reasonsOf([lanternBank, { ...battery, ports: [battery.ports![1]!] }, radio], 'radio');
    expect(d.reasons).toEqual([
      // 5 V is far below 11.73 V.
      "Lantern's USB-A gives 5 V; Radio needs 11.73–15.87 V at its genderless DC connector: that takes an adapter that converts the voltage, not just a cable",
      // 12.8 V lies inside 11.73–15.87 V: a socket-to-genderless lead would do.
      "no cable or adapter in the kit joins Battery's 12 V socket to Radio's genderless DC connector",
    ]);
  });

  it('two banks each short of current: one sentence per bank, each with its own figures', () => {
    // The phone takes plain 5 V at 2 A = 10 W (no PD).
    const phone: KitPowerItem = { id: 'phone', name: 'Phone', role: 'device', ports: [{ kind: 'usb-c', direction: 'input', volts: 5, amps: 2 }] };
    const small: KitPowerItem = { id: 'small', name: 'Small bank', role: 'storage', ports: [{ kind: 'usb-a', direction: 'output', volts: 5, amps: 1 }] };
    const aToC: KitPowerItem = { id: 'a-to-c', name: 'A-to-C cable', role: 'cable', from: { kind: 'usb-a' }, to: { kind: 'usb-c', amps: 3 } };
    // Type-C Current @1.5 A: 5 V × 1.5 A = 7.5 W < 10 W.
    const c15: KitPowerItem = { id: 'c15', name: 'Slim bank', role: 'storage', ports: [{ kind: 'usb-c', direction: 'output', volts: 5, amps: 1.5 }] };
    const d = reasonsOf([small, aToC, c15, phone], 'phone');
    expect(d.reasons).toEqual([
      // 1 A (the bank's USB-A; the cable's 3 A rating does not add current) < 2 A.
      'Phone needs 5 V at 2 A; Small bank through A-to-C cable delivers at most 1 A',
      // 1.5 A < 2 A.
      'Phone needs 5 V at 2 A; Slim bank delivers at most 1.5 A',
    ]);
    // Type-C Current @3.0 A: 5 V × 3 A = 15 W ≥ 10 W — a third bank gives a path and the reasons go.
    const c30: KitPowerItem = { id: 'c30', name: 'Big bank', role: 'storage', ports: [{ kind: 'usb-c', direction: 'output', volts: 5, amps: 3 }] };
    const ok = reasonsOf([small, aToC, c15, c30, phone], 'phone');
    expect(ok.reasons).toEqual([]);
    expect(ok.paths.map((p) => p.steps[0]!.itemId)).toEqual(['c30']);
  });

  it('a panel that charges a battery is not blamed separately: the battery’s missing lead is the reason', () => {
    // 18 V into the battery's 12–28 V solar input fits; the battery's socket has no lead to the radio.
    const d = reasonsOf([panel, { ...battery, ports: [battery.ports![1]!, battery.ports![2]!] }, { ...radio, ports: [{ ...radio.ports![0]!, kind: 'dc-barrel' }] }], 'radio');
    expect(d.reasons).toEqual(["no cable or adapter in the kit joins Battery's 12 V socket to Radio's DC barrel"]);
  });
});

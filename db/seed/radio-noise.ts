/*
 * Two demo radio-noise checks (issue 9), invented and plausible, both approved:
 * - the Voltmoth Cellhive 20 bank powering the receiver through a 12 V trigger lead: a clear rise on 80 m
 *   (two S-units), a slight one on 40 m and 10 m, quiet above 30 MHz;
 * - the Brackenfold Heathray 60 panel with its built-in regulator charging a battery in full sun, 3 m from
 *   the antenna: quiet on every band.
 * Readings go through the same schema and dBm conversion as the logbook form, and the measured noise-rise
 * specs through the same code as an approval (db/radio-noise.ts), once, when a test is first inserted.
 */
import { inArray } from 'drizzle-orm';
import type { Db } from '../connection';
import { fieldTestItems, fieldTests, gearItems, radioNoiseReadings } from '../schema';
import { applyRadioNoiseSpecs, readingRow } from '../radio-noise';
import { bandFigures, radioNoiseBandSchema } from '../../lib/field-tests/radio-noise';
import { DEMO_PLACES, type DemoUserKey } from './demo-data';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

const HF_SSB = { mode: 'ssb', bandwidthHz: 2400 } as const;
const VHF_FM = { mode: 'fm', bandwidthHz: 12_500 } as const;
const S = (sUnits: number, dbOverS9 = 0) => ({ scale: 's-meter' as const, sUnits, dbOverS9 });
const dBm = (dbm: number) => ({ scale: 'dbm' as const, dbm });

const RECEIVER = { name: 'Portable HF/VHF/UHF all-mode transceiver, used as a receiver only', accuracy: 'S-meter checked against a signal generator at S9 on 7.1 and 145 MHz (±2 dB)' };

export const DEMO_RADIO_NOISE_TESTS = [
  {
    id: 'demo-ft-cellhive-radio-noise',
    item: 'voltmoth-cellhive-20',
    owner: 'reviewer2' as DemoUserKey,
    testedAt: new Date('2026-10-06T19:30:00Z'),
    approvedAt: new Date('2026-10-08T09:10:00Z'),
    sky: 'clear' as const,
    ambientC: 9,
    methodNotes:
      'Reference supply: a 12 V 7 Ah lead-acid battery, no charger attached. Receiver on the picnic table at Upper Meadow camp, far from mains wiring; end-fed wire antenna for HF, a quarter-wave whip for 2 m and 70 cm. For each band: noise floor read on the battery, then with the bank powering the receiver through its USB-C 12 V trigger lead, the bank 0.5 m from the receiver. Readings after 30 s on a clear frequency.',
    bands: [
      { band: '80 m', frequencyMHz: 3.65, ...HF_SSB, antenna: 'End-fed wire, 20 m', distanceM: 0.5, baseline: S(4), withItem: S(6) },
      { band: '40 m', frequencyMHz: 7.1, ...HF_SSB, antenna: 'End-fed wire, 20 m', distanceM: 0.5, baseline: S(3), withItem: dBm(-105) },
      { band: '20 m', frequencyMHz: 14.2, ...HF_SSB, antenna: 'End-fed wire, 20 m', distanceM: 0.5, baseline: S(2), withItem: S(2) },
      { band: '10 m', frequencyMHz: 28.5, ...HF_SSB, antenna: 'End-fed wire, 20 m', distanceM: 0.5, baseline: dBm(-121), withItem: dBm(-119) },
      { band: '2 m', frequencyMHz: 145.5, ...VHF_FM, antenna: 'Quarter-wave whip', distanceM: 0.5, baseline: dBm(-124), withItem: dBm(-123.5) },
      { band: '70 cm', frequencyMHz: 433.5, ...VHF_FM, antenna: 'Quarter-wave whip', distanceM: 0.5, baseline: dBm(-122), withItem: dBm(-122) },
    ],
  },
  {
    id: 'demo-ft-heathray60-radio-noise',
    item: 'brackenfold-heathray-60',
    owner: 'reviewer' as DemoUserKey,
    testedAt: new Date('2026-10-07T12:30:00Z'),
    approvedAt: new Date('2026-10-08T09:20:00Z'),
    sky: 'clear' as const,
    ambientC: 14,
    methodNotes:
      'Reference supply: a 12 V 7 Ah lead-acid battery, no charger attached. The panel in full sun charging a second battery through its built-in regulator (about 3.4 A at the time), laid out 3 m from the antenna feed point. For each band: noise floor with the panel covered, then uncovered and charging.',
    bands: [
      { band: '40 m', frequencyMHz: 7.1, ...HF_SSB, antenna: 'End-fed wire, 20 m', distanceM: 3, baseline: S(3), withItem: S(3) },
      { band: '20 m', frequencyMHz: 14.2, ...HF_SSB, antenna: 'End-fed wire, 20 m', distanceM: 3, baseline: S(2), withItem: S(2) },
      { band: '15 m', frequencyMHz: 21.2, ...HF_SSB, antenna: 'End-fed wire, 20 m', distanceM: 3, baseline: dBm(-118), withItem: dBm(-117.2) },
      { band: '6 m', frequencyMHz: 50.15, ...HF_SSB, antenna: 'Quarter-wave whip', distanceM: 3, baseline: dBm(-128), withItem: dBm(-127.6) },
      { band: '2 m', frequencyMHz: 145.5, ...VHF_FM, antenna: 'Quarter-wave whip', distanceM: 3, baseline: dBm(-124), withItem: dBm(-124) },
    ],
  },
] as const;

/** Inserts each demo radio-noise check once (when its item exists) and writes its measured specs; returns the tests inserted. */
export function seedDemoRadioNoise(tx: Tx, userId: (key: DemoUserKey) => string): number {
  let inserted = 0;
  for (const demo of DEMO_RADIO_NOISE_TESTS) {
    const gearItemId = `demo-gear-${demo.item}`;
    const item = tx.select().from(gearItems).where(inArray(gearItems.id, [gearItemId])).get();
    if (!item) continue;
    const added = tx
      .insert(fieldTests)
      .values({
        id: demo.id,
        ownerId: userId(demo.owner),
        kind: 'radio-noise',
        testedAt: demo.testedAt,
        placeLabel: DEMO_PLACES.meadow,
        sky: demo.sky,
        ambientC: demo.ambientC,
        instruments: [RECEIVER],
        methodNotes: demo.methodNotes,
        status: 'approved',
        approvedAt: demo.approvedAt,
        createdAt: demo.testedAt,
        updatedAt: demo.approvedAt,
      })
      .onConflictDoNothing()
      .run().changes;
    if (added === 0) continue;
    tx.insert(fieldTestItems).values({ fieldTestId: demo.id, gearItemId }).onConflictDoNothing().run();
    tx.insert(radioNoiseReadings)
      .values(
        demo.bands.map((raw, position) => {
          const band = radioNoiseBandSchema.parse({ item: demo.item, ...raw });
          return { ...readingRow(demo.id, gearItemId, position, band, bandFigures(band)), id: `${demo.id}-band-${position + 1}` };
        }),
      )
      .onConflictDoNothing()
      .run();
    const test = tx.select().from(fieldTests).where(inArray(fieldTests.id, [demo.id])).get()!;
    applyRadioNoiseSpecs(tx, { id: userId('editor'), role: 'editor' }, test, [item], demo.approvedAt);
    inserted += 1;
  }
  return inserted;
}

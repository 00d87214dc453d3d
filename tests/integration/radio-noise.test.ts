import { beforeEach, describe, expect, it } from 'vitest';
import { createTestDb } from '@/db/test-db';
import type { Db } from '@/db/connection';
import type { Actor } from '@/db/gear';
import { gearItems } from '@/db/schema';
import { createUser } from '@/db/users';
import { itemRadioNoise, radioNoiseOfItem } from '@/db/radio-noise';
import { handleCreateFieldTest, handleTransition } from '@/app/api/v1/field-tests/handlers';
import { handleGetRadioNoise, handlePutRadioNoise } from '@/app/api/v1/field-tests/radio-noise-handlers';

/*
 * Radio-noise checks through the route handlers: band readings written and read back with their dBm
 * (IARU Region 1 Rec. R.1, check-values.md §12), the owner-only / editable-only rules
 * (security-tests.md AC-02, CS-01), every refusal a 4xx that leaves the database as it was, and the
 * measured noise-rise specs written on approval.
 */

const ORIGIN = 'http://localhost:3000';
let db: Db;
let u: Record<'author' | 'other' | 'editor' | 'reader', Actor>;
let bankId: string;
let panelId: string;

function addItem(slug: string, category: string, ownerId: string, opts: { public?: boolean } = {}) {
  const id = `item-${slug}`;
  const at = new Date('2026-09-01T00:00:00Z');
  db.insert(gearItems)
    .values({ id, slug, ownerId, name: slug.replace(/-/g, ' '), maker: 'Voltmoth', category, status: opts.public === false ? 'draft' : 'approved', approvedAt: opts.public === false ? null : at, priceMinor: 4000, priceCurrency: 'USD', createdAt: at, updatedAt: at })
    .run();
  return id;
}

const json = (method: string, path: string, body: unknown, headers: Record<string, string> = {}) =>
  new Request(`${ORIGIN}${path}`, { method, headers: { 'content-type': 'application/json', origin: ORIGIN, ...headers }, body: typeof body === 'string' ? body : JSON.stringify(body) });

type Body = { radioNoise?: { readings: { band: string; range: string; baselineDbm: number; withItemDbm: number; riseDb: number; verdict: string }[]; summaries: { item: string; byRange: Record<string, { worstRiseDb: number; verdict: string } | null> }[] }; error?: { code: string; message: string; fields?: Record<string, string[]> } };

async function newTest(items: string[] = ['bank'], kind = 'radio-noise', user: Actor = u.author) {
  const res = await handleCreateFieldTest(
    db,
    user,
    json('POST', '/api/v1/field-tests', { kind, testedAt: '2026-10-03T20:00', placeLabel: 'Upper Meadow camp', sky: 'clear', ambientC: 8, instruments: [{ name: 'HF/VHF receiver, S-meter' }], methodNotes: 'Reference supply: a 12 V lead-acid battery, no charger.', items }),
  );
  expect(res.status).toBe(201);
  return ((await res.json()) as { fieldTest: { id: string } }).fieldTest.id;
}

const band = (over: Record<string, unknown> = {}) => ({
  item: 'bank',
  band: '40 m',
  frequencyMHz: 7.1,
  mode: 'ssb',
  bandwidthHz: 2400,
  antenna: 'End-fed wire, 10 m',
  distanceM: 1,
  baseline: { scale: 's-meter', sUnits: 3 },
  withItem: { scale: 's-meter', sUnits: 5 },
  ...over,
});

async function put(user: Actor | null, id: string, body: unknown, headers: Record<string, string> = {}) {
  const res = await handlePutRadioNoise(db, user, id, json('PUT', `/api/v1/field-tests/${id}/radio-noise`, body, headers));
  return { status: res.status, body: (await res.json()) as Body };
}

async function get(user: Actor | null, id: string) {
  const res = await handleGetRadioNoise(db, user, id);
  return { status: res.status, body: (await res.json()) as Body };
}

async function act(user: Actor, id: string, action: string) {
  const res = await handleTransition(db, user, id, json('POST', `/api/v1/field-tests/${id}/transitions`, { action }));
  return { status: res.status, body: (await res.json()) as { fieldTest?: { status: string; measured: number }; error?: { message: string } } };
}

const TABLES = ['radio_noise_readings', 'field_tests', 'specs', 'spec_changes'];
const counts = () => Object.fromEntries(TABLES.map((t) => [t, (db.$client.prepare(`select count(*) as n from ${t}`).get() as { n: number }).n]));
const stored = () => db.$client.prepare('select band, baseline_dbm, with_item_dbm from radio_noise_readings order by field_test_id, position').all();
const measured = (itemId: string, key: string) =>
  db.$client.prepare("select value, n, field_test_id as fieldTestId from specs where gear_item_id = ? and key = ? and basis = 'measured'").get(itemId, key) as { value: number; n: number; fieldTestId: string } | undefined;

beforeEach(() => {
  db = createTestDb().db;
  const make = (key: string, role: Actor['role']) => {
    const user = createUser(db, { email: `${key}@example.org`, name: key, passwordHash: null, role });
    return { id: user.id, role: user.role };
  };
  u = { author: make('author', 'reviewer'), other: make('other', 'reviewer'), editor: make('editor', 'editor'), reader: make('reader', 'reader') };
  bankId = addItem('bank', 'power-bank', u.author.id);
  panelId = addItem('panel', 'solar-panel', u.author.id);
  addItem('handheld', 'radio', u.author.id);
});

describe('writing and reading band readings', () => {
  it('stores each reading as entered and in dBm (IARU R.1), with range, rise and verdict', async () => {
    const id = await newTest(['bank', 'panel']);
    const { status, body } = await put(u.author, id, {
      readings: [
        band(),
        band({ band: '2 m', frequencyMHz: 145.5, mode: 'fm', bandwidthHz: 12_500, baseline: { scale: 's-meter', sUnits: 9, dbOverS9: 0 }, withItem: { scale: 's-meter', sUnits: 9, dbOverS9: 10 } }),
        band({ item: 'panel', band: '20 m', frequencyMHz: 14.2, baseline: { scale: 'dbm', dbm: -121 }, withItem: { scale: 'dbm', dbm: -120.5 } }),
        band({ item: 'panel', band: '10 m', frequencyMHz: 30, baseline: { scale: 's-meter', sUnits: 1 }, withItem: { scale: 's-meter', sUnits: 1 } }),
      ],
    });
    expect(status).toBe(200);
    const r = body.radioNoise!.readings;
    // check-values.md §12 (IARU Region 1 Rec. R.1): HF S3 = −73 − 36 = −109 dBm, S5 = −97 dBm: a 12 dB rise.
    expect(r[0]).toMatchObject({ band: '40 m', range: 'below-30mhz', baselineDbm: -109, withItemDbm: -97, riseDb: 12, verdict: 'noisy' });
    // Above 30 MHz S9 = −93 dBm; S9 + 10 dB = −83 dBm.
    expect(r[1]).toMatchObject({ band: '2 m', range: 'above-30mhz', baselineDbm: -93, withItemDbm: -83, riseDb: 10, verdict: 'noisy' });
    // dBm as entered; 0.5 dB is under our 1 dB "quiet" threshold (lib/measure RADIO_QUIET_THRESHOLDS_DB, our own convention).
    expect(r[2]).toMatchObject({ range: 'below-30mhz', baselineDbm: -121, withItemDbm: -120.5, riseDb: 0.5, verdict: 'quiet' });
    // 30 MHz itself is HF (ITU RR Art. 2: a band includes its upper limit): S1 = −73 − 48 = −121 dBm.
    expect(r[3]).toMatchObject({ range: 'below-30mhz', baselineDbm: -121, riseDb: 0 });
    const bankSummary = body.radioNoise!.summaries.find((s) => s.item === 'bank')!;
    expect(bankSummary.byRange['below-30mhz']).toMatchObject({ worstRiseDb: 12, verdict: 'noisy' });
    expect(bankSummary.byRange['above-30mhz']).toMatchObject({ worstRiseDb: 10, verdict: 'noisy' });

    // A second PUT replaces the set.
    expect((await put(u.author, id, { readings: [band({ withItem: { scale: 's-meter', sUnits: 3 } }), band({ item: 'panel' })] })).status).toBe(200);
    const back = await get(u.author, id);
    expect(back.body.radioNoise!.readings.map((x) => x.riseDb)).toEqual([0, 12]);
  });

  it('refuses bad input with 422 and clear messages, leaving the database as it was', async () => {
    const id = await newTest();
    await put(u.author, id, { readings: [band()] });
    const before = { counts: counts(), rows: stored() };
    const cases: [unknown, RegExp][] = [
      [{ readings: [band({ baseline: { scale: 's-meter', sUnits: 10 } })] }, /S-units run from 0 to 9/],
      [{ readings: [band({ withItem: { scale: 's-meter', sUnits: 7, dbOverS9: 10 } })] }, /applies only to a reading of S9/],
      [{ readings: [band({ mode: 'ssb-wide' })] }, /Choose the mode: SSB, CW, AM, FM, Data/],
      [{ readings: [band({ frequencyMHz: 0 })] }, /greater than 0 MHz/],
      [{ readings: [band({ frequencyMHz: -7 })] }, /greater than 0 MHz/],
      [{ readings: [band({ bandwidthHz: 0 })] }, /bandwidth must be greater than 0/],
      [{ readings: [band({ distanceM: -1 })] }, /distance cannot be negative/],
      [{ readings: [band({ baseline: { scale: 'dbm', dbm: 12 } })] }, /not a noise floor/],
      [{ readings: [band({ baseline: { scale: 'dbm', dbm: -200 } })] }, /thermal noise floor/],
      [{ readings: [band({ baseline: { scale: 'volts', value: 1 } })] }, /S-meter or dBm/],
      [{ readings: [band({ band: '' })] }, /Name the band/],
      [{ readings: [band({ item: 'handheld' })] }, /one of the items of this test/],
      [{ readings: [band({ frequencyMHz: 'seven' })] }, /frequency \(MHz\) as a number/],
      [{ readings: [] }, /at least one band/],
      [{ readings: Array.from({ length: 61 }, () => band()) }, /At most 60/],
      [{}, /./],
    ];
    for (const [body, message] of cases) {
      const r = await put(u.author, id, body);
      expect(r.status, JSON.stringify(body).slice(0, 120)).toBe(422);
      expect(JSON.stringify(r.body.error), JSON.stringify(body).slice(0, 120)).toMatch(message);
    }
    // Malformed JSON 400, wrong media type 415: nothing stored either.
    const broken = await handlePutRadioNoise(db, u.author, id, json('PUT', '/x', '{"readings": ['));
    expect(broken.status).toBe(400);
    const text = await handlePutRadioNoise(db, u.author, id, new Request(`${ORIGIN}/x`, { method: 'PUT', headers: { 'content-type': 'text/plain', origin: ORIGIN }, body: 'readings' }));
    expect(text.status).toBe(415);
    expect({ counts: counts(), rows: stored() }).toEqual(before);
  });

  it('only the author, only while editable, only for a radio-noise test', async () => {
    const id = await newTest();
    expect((await put(null, id, { readings: [band()] })).status).toBe(401);
    // Another reviewer cannot see the draft at all (404, as for an unknown id); the editor sees it but may not change it (403).
    expect((await put(u.other, id, { readings: [band()] })).status).toBe(404);
    expect((await get(u.other, id)).status).toBe(404);
    expect((await get(null, id)).status).toBe(404);
    expect((await put(u.editor, id, { readings: [band()] })).status).toBe(403);
    // Cross-site cookie write refused (security-tests.md CS-01).
    expect((await put(u.author, id, { readings: [band()] }, { origin: 'https://elsewhere.example' })).status).toBe(403);
    expect((await put(u.author, 'no-such-test', { readings: [band()] })).status).toBe(404);

    const massCheck = await newTest(['bank'], 'mass-check');
    const wrongKind = await put(u.author, massCheck, { readings: [band()] });
    expect(wrongKind.status).toBe(422);
    expect(wrongKind.body.error!.message).toMatch(/mass check test: band readings belong to a radio-noise check/);

    // Not submittable without readings for each item; then locked once submitted (409).
    expect((await act(u.author, id, 'submit')).body.error!.message).toMatch(/at least one band reading/);
    expect((await put(u.author, id, { readings: [band()] })).status).toBe(200);
    expect((await act(u.author, id, 'submit')).status).toBe(200);
    const before = counts();
    const locked = await put(u.author, id, { readings: [band({ withItem: { scale: 's-meter', sUnits: 3 } })] });
    expect(locked.status).toBe(409);
    expect(counts()).toEqual(before);
    expect(stored()).toEqual([{ band: '40 m', baseline_dbm: -109, with_item_dbm: -97 }]);
  });

  it('a radio can not be the item of a radio-noise check (the receiver is the instrument)', async () => {
    const res = await handleCreateFieldTest(db, u.author, json('POST', '/api/v1/field-tests', { kind: 'radio-noise', testedAt: '2026-10-03T20:00', placeLabel: 'Upper Meadow camp', sky: 'clear', ambientC: 8, instruments: [], methodNotes: '', items: ['handheld'] }));
    expect(res.status).toBe(422);
  });
});

describe('approval writes the measured noise-rise specs', () => {
  it('worst rise per range over the item’s approved tests; pending tests stay off the item', async () => {
    const first = await newTest(['bank', 'panel']);
    await put(u.author, first, {
      readings: [
        band(), // 40 m: S3 → S5, 12 dB
        band({ band: '80 m', frequencyMHz: 3.6, withItem: { scale: 's-meter', sUnits: 4 } }), // 6 dB
        band({ band: '2 m', frequencyMHz: 145.5, mode: 'fm', bandwidthHz: 12_500, baseline: { scale: 'dbm', dbm: -125 }, withItem: { scale: 'dbm', dbm: -122 } }), // 3 dB
        band({ item: 'panel', baseline: { scale: 'dbm', dbm: -110 }, withItem: { scale: 'dbm', dbm: -109.6 } }), // 0.4 dB
      ],
    });
    expect(itemRadioNoise(db, bankId, u.author)).toBeNull(); // a draft is not on the item
    await act(u.author, first, 'submit');
    const approved = await act(u.editor, first, 'approve');
    expect(approved.status).toBe(200);
    expect(approved.body.fieldTest!.measured).toBe(3); // bank below + above, panel below
    expect(measured(bankId, 'noiseRiseBelow30')).toEqual({ value: 12, n: 2, fieldTestId: first });
    expect(measured(bankId, 'noiseRiseAbove30')).toEqual({ value: 3, n: 1, fieldTestId: first });
    expect(measured(panelId, 'noiseRiseBelow30')!.value).toBeCloseTo(0.4, 10);
    expect(measured(panelId, 'noiseRiseAbove30')).toBeUndefined();

    // A later, quieter test does not hide the worst band of an earlier one: the spec stays the worst over approved tests.
    const second = await newTest(['bank']);
    await put(u.author, second, { readings: [band({ withItem: { scale: 's-meter', sUnits: 3 } }), band({ band: '2 m', frequencyMHz: 145.5, mode: 'fm', baseline: { scale: 'dbm', dbm: -125 }, withItem: { scale: 'dbm', dbm: -116 } })] });
    await act(u.author, second, 'submit');
    expect((await act(u.editor, second, 'approve')).status).toBe(200);
    expect(measured(bankId, 'noiseRiseBelow30')).toEqual({ value: 12, n: 3, fieldTestId: first });
    expect(measured(bankId, 'noiseRiseAbove30')).toEqual({ value: 9, n: 2, fieldTestId: second });

    const item = await radioNoiseOfItem(bankId, { db });
    expect(item!.readings).toHaveLength(5);
    expect(item!.summary.byRange['below-30mhz']).toMatchObject({ worstRiseDb: 12, worstBand: '40 m', verdict: 'noisy' });
    expect(item!.summary.byRange['above-30mhz']).toMatchObject({ worstRiseDb: 9, worstBand: '2 m', verdict: 'noisy' });
    expect(item!.readings.every((r) => r.fieldTestId === first || r.fieldTestId === second)).toBe(true);

    // A pending third test of the same item stays off the item page for everyone.
    const third = await newTest(['bank']);
    await put(u.author, third, { readings: [band({ withItem: { scale: 's-meter', sUnits: 9, dbOverS9: 20 } })] });
    expect((await radioNoiseOfItem(bankId, { db, viewerId: u.author.id }))!.readings).toHaveLength(5);
    expect((await get(null, first)).status).toBe(200);
  });
});

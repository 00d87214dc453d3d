import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { verifyPassword } from '@/lib/auth/password';
import { energyWh, isCategory, lightRuntime, summarize, valueRatios, type Specs } from '@/lib/measure';
import { ROLES } from '@/db/schema';
import { decodeSeries } from '@/lib/readings';
import type { Db } from '@/db/connection';
import { createTestDb } from '@/db/test-db';
import { DEMO_ACCOUNTS, DEMO_EMAIL_DOMAIN, DEMO_MAKERS, isDatabaseEmpty, seedDemo, type SeedResult } from '@/db/seed';

/*
 * The demo seed on a fresh database: what it creates, that a second run creates nothing, and that
 * the measured figures it stores follow from the readings it stores. The expected runtimes are
 * exact by hand from the generator's shape (flat, then a straight fade sampled on the line):
 * runtime = fadeEnd − fadeLength × 0.1 × reference ÷ level at fade start.
 */

let db: Db;
let first: SeedResult;
let emptyBefore: boolean;

function tableNames(): string[] {
  return (
    db.$client.prepare("select name from sqlite_master where type = 'table' and name not like 'sqlite_%' and name not like '__drizzle%' order by name").all() as {
      name: string;
    }[]
  ).map((r) => r.name);
}

function rowCounts(): Record<string, number> {
  return Object.fromEntries(tableNames().map((name) => [name, (db.$client.prepare(`select count(*) as n from "${name}"`).get() as { n: number }).n]));
}

function all<T>(query: string, ...params: unknown[]): T[] {
  return db.$client.prepare(query).all(...params) as T[];
}

beforeAll(async () => {
  db = createTestDb().db;
  emptyBefore = isDatabaseEmpty(db);
  first = await seedDemo(db);
});

afterAll(() => {
  db.$client.close();
});

describe('seedDemo on a fresh database', () => {
  it('reports an empty database before and a non-empty one after', () => {
    expect(emptyBefore).toBe(true);
    expect(first.created).toBe(true);
    expect(isDatabaseEmpty(db)).toBe(false);
  });

  it('creates at least 24 gear items across at least 6 categories, most of them approved', () => {
    const items = all<{ category: string; status: string; maker: string; price_minor: number; price_currency: string }>('select category, status, maker, price_minor, price_currency from gear_items');
    expect(items.length).toBeGreaterThanOrEqual(24);
    expect(new Set(items.map((i) => i.category)).size).toBeGreaterThanOrEqual(6);
    expect(items.filter((i) => i.status === 'approved').length).toBeGreaterThan(items.length / 2);
    expect(new Set(items.map((i) => i.status))).toEqual(new Set(['approved', 'draft', 'in-review', 'changes-requested']));
    for (const item of items) {
      expect(DEMO_MAKERS as readonly string[]).toContain(item.maker);
      expect(Number.isInteger(item.price_minor) && item.price_minor > 0).toBe(true);
    }
    expect(new Set(items.map((i) => i.price_currency))).toEqual(new Set(['USD', 'EUR']));
  });

  it('gives every item claimed specs with a known key, a claim source and a positive finite value', () => {
    const keys = ['mass', 'luminousFlux', 'runtime', 'peakIntensity', 'ratedEnergy', 'deliveredEnergy', 'ratedPower', 'powerDraw', 'transmitPower', 'supplyVoltage', 'continuousPower', 'noiseRiseBelow30', 'noiseRiseAbove30'];
    const specs = all<{ gear_item_id: string; key: string; mode: string; basis: string; value: number; claim_source: string | null }>('select * from specs');
    for (const s of specs) {
      expect(keys).toContain(s.key);
      expect(Number.isFinite(s.value) && s.value > 0).toBe(true);
      if (s.basis === 'claimed') expect(['packaging', 'manual', 'makers-site']).toContain(s.claim_source);
      if (s.key === 'powerDraw') expect(s.mode).not.toBe('');
    }
    const withoutClaims = all('select id from gear_items where id not in (select gear_item_id from specs where basis = ?)', 'claimed');
    expect(withoutClaims).toEqual([]);
    const withoutMass = all('select id from gear_items where id not in (select gear_item_id from specs where key = ? and basis = ?)', 'mass', 'claimed');
    expect(withoutMass).toEqual([]);
  });

  it('gives every item figures lib/measure can turn into value ratios', () => {
    const items = all<{ id: string; category: string; price_minor: number; price_currency: string }>('select id, category, price_minor, price_currency from gear_items');
    const ratioIds = new Map<string, string[]>();
    for (const item of items) {
      expect(isCategory(item.category)).toBe(true);
      if (!isCategory(item.category)) continue;
      const specs: Record<string, { claimed?: number; measured?: number }> = {};
      for (const s of all<{ key: string; basis: 'claimed' | 'measured'; value: number }>("select key, basis, value from specs where gear_item_id = ? and mode = ''", item.id)) {
        specs[s.key] = { ...specs[s.key], [s.basis]: s.value };
      }
      const ratios = valueRatios(item.category, specs as Specs, { amountMinor: item.price_minor, currency: item.price_currency });
      ratioIds.set(item.id, ratios.map((r) => r.id));
    }
    expect(ratioIds.get('demo-gear-glowmere-hearthglow-400')).toEqual(expect.arrayContaining(['lm-per-g', 'lm-per-money', 'measured-vs-claimed:runtime', 'measured-vs-claimed:mass']));
    expect(ratioIds.get('demo-gear-voltmoth-cellhive-20')).toEqual(expect.arrayContaining(['wh-per-kg', 'delivered-wh-per-money', 'delivered-vs-rated']));
    expect(ratioIds.get('demo-gear-brackenfold-heathray-60')).toEqual(expect.arrayContaining(['w-per-kg', 'w-per-money']));
  });

  it('creates demo users of every role at the demo domain, marked as demo, with working passwords', async () => {
    const users = all<{ email: string; role: string; is_demo: number; password_hash: string }>('select email, role, is_demo, password_hash from users');
    expect(new Set(users.map((u) => u.role))).toEqual(new Set(ROLES));
    for (const u of users) {
      expect(u.email.endsWith(`@${DEMO_EMAIL_DOMAIN}`)).toBe(true);
      expect(u.is_demo).toBe(1);
    }
    for (const account of DEMO_ACCOUNTS) {
      expect(account.password.length).toBeGreaterThanOrEqual(12);
      const row = users.find((u) => u.email === account.email);
      expect(row?.role).toBe(account.role);
      expect(await verifyPassword(row?.password_hash ?? '', account.password)).toBe(true);
    }
  });

  it('creates reviews with revisions in at least 4 states, each state matching its last event', () => {
    const revisions = all<{ id: string; state: string; published_at: number | null }>('select id, state, published_at from review_revisions');
    const states = new Set(revisions.map((r) => r.state));
    expect(states.size).toBeGreaterThanOrEqual(4);
    for (const s of ['published', 'in-review', 'draft', 'changes-requested', 'retracted']) expect(states).toContain(s);
    for (const r of revisions) {
      const last = all<{ to_state: string }>('select to_state from review_state_events where revision_id = ? order by created_at desc, id desc limit 1', r.id)[0];
      expect(last?.to_state).toBe(r.state);
      if (r.state === 'published' || r.state === 'retracted') expect(r.published_at).not.toBeNull();
    }
    const commented = all<{ comment: string }>("select comment from review_state_events where to_state = 'changes-requested'");
    expect(commented.length).toBeGreaterThan(0);
    expect(commented.every((e) => e.comment.length > 0)).toBe(true);
    const sideBySide = all<{ n: number }>('select count(*) as n from review_items group by review_id having n > 1');
    expect(sideBySide.length).toBeGreaterThan(0);
  });

  // Stored results equal lib/measure on the stored readings; the lantern's runtimes are also checked by hand.
  it('stores measured specs that follow from their approved field test readings', () => {
    const measured = all<{ gear_item_id: string; key: string; value: number; sd: number | null; n: number; field_test_id: string; status: string }>(
      "select s.gear_item_id, s.key, s.value, s.sd, s.n, s.field_test_id, f.status from specs s join field_tests f on f.id = s.field_test_id where s.basis = 'measured'",
    );
    expect(measured.length).toBeGreaterThanOrEqual(5);
    expect(all("select id from specs where basis = 'measured' and field_test_id is null")).toEqual([]);
    for (const m of measured) expect(m.status).toBe('approved');

    const trialsOf = (testId: string, itemId: string) =>
      all<{ id: string; typed_values: string | null }>('select id, typed_values from trials where field_test_id = ? and gear_item_id = ? order by id', testId, itemId);
    // Every row of a trial's readings is stored as one TBS1 series (lib/readings encodeSeries).
    const series = (trialId: string) => {
      const row = all<{ series: Buffer | null }>('select series from trials where id = ?', trialId)[0];
      const decoded = row?.series ? decodeSeries(new Uint8Array(row.series)) : null;
      if (!decoded?.ok) return [];
      return decoded.samples.map((s) => ({ t: s.t, value: s.value ?? null, watts: s.watts ?? null }));
    };

    // Radio-noise specs come from band readings, not trials: worst rise per range (IARU Region 1 Rec. R.1, check-values.md §12).
    // Cellhive 20: 80 m S4 → S6 is 2 S-units × 6 dB = 12 dB; above 30 MHz 2 m −124 → −123.5 dBm = 0.5 dB.
    // Heathray 60: 15 m −118 → −117.2 dBm = 0.8 dB; 6 m −128 → −127.6 dBm = 0.4 dB.
    const noise = (item: string, key: string) => measured.find((m) => m.gear_item_id === `demo-gear-${item}` && m.key === key)?.value;
    expect(noise('voltmoth-cellhive-20', 'noiseRiseBelow30')).toBeCloseTo(12, 9);
    expect(noise('voltmoth-cellhive-20', 'noiseRiseAbove30')).toBeCloseTo(0.5, 9);
    expect(noise('brackenfold-heathray-60', 'noiseRiseBelow30')).toBeCloseTo(0.8, 9);
    expect(noise('brackenfold-heathray-60', 'noiseRiseAbove30')).toBeCloseTo(0.4, 9);

    for (const m of measured.filter((x) => !x.key.startsWith('noiseRise'))) {
      const trials = trialsOf(m.field_test_id, m.gear_item_id);
      expect(trials.length).toBe(m.n);
      let perTrial: number[];
      if (m.key === 'runtime') {
        perTrial = trials.map((t) => lightRuntime(series(t.id).map((r) => ({ t: r.t, value: r.value ?? 0 }))).runtimeS ?? Number.NaN);
      } else if (m.key === 'deliveredEnergy') {
        perTrial = trials.map((t) => energyWh(series(t.id).map((r) => ({ t: r.t, watts: r.watts ?? 0 }))));
      } else {
        perTrial = trials.map((t) => (JSON.parse(t.typed_values ?? '{}') as Record<string, number>)[m.key] ?? Number.NaN);
      }
      const summary = summarize(perTrial);
      expect(m.value).toBeCloseTo(summary.mean, 9);
      if (summary.sd === null) expect(m.sd).toBeNull();
      else expect(m.sd).toBeCloseTo(summary.sd, 9);
    }

    // The lantern's two runtimes, exact by hand: 16800 − 6000 × 41.2 / 400 = 16182 s and 17100 − 6000 × 40.8 / 400 = 16488 s.
    const lantern = measured.find((m) => m.key === 'runtime' && m.gear_item_id === 'demo-gear-glowmere-hearthglow-400');
    expect(lantern?.value).toBeCloseTo((16182 + 16488) / 2, 6);
    expect(lantern?.sd).toBeCloseTo(306 / Math.SQRT2, 6);
  });

  it('includes approved and draft field tests with trials and readings of every kind', () => {
    const tests = all<{ id: string; kind: string; status: string; place_label: string }>('select id, kind, status, place_label from field_tests');
    expect(new Set(tests.map((t) => t.kind))).toEqual(new Set(['light-runtime', 'energy-delivered', 'solar-output', 'mass-check', 'port-output', 'radio-noise']));
    expect(tests.some((t) => t.status === 'draft')).toBe(true);
    expect(tests.filter((t) => t.status === 'approved').length).toBeGreaterThanOrEqual(3);
    for (const t of tests) expect(['Upper Meadow camp', 'Lakeshore test bench']).toContain(t.place_label);
    const seriesless = all("select t.id from trials t join field_tests f on f.id = t.field_test_id where f.kind not in ('mass-check', 'port-output') and (t.series is null or t.series_length < 2)");
    expect(seriesless).toEqual([]);
    const trialless = all("select id from field_tests where kind != 'radio-noise' and id not in (select field_test_id from trials)");
    expect(trialless).toEqual([]);
    // A radio-noise check holds band readings instead of trials.
    const bandless = all("select id from field_tests where kind = 'radio-noise' and id not in (select field_test_id from radio_noise_readings)");
    expect(bandless).toEqual([]);
    expect(all("select id from field_tests where kind = 'radio-noise' and status = 'approved'").length).toBeGreaterThanOrEqual(2);
    const unlinked = all('select t.id from trials t left join field_test_items i on i.field_test_id = t.field_test_id and i.gear_item_id = t.gear_item_id where i.field_test_id is null');
    expect(unlinked).toEqual([]);
  });

  it('creates demo kits', () => {
    const kits = all<{ id: string; n: number }>('select k.id, count(e.id) as n from kits k join kit_entries e on e.kit_id = k.id group by k.id');
    expect(kits.length).toBeGreaterThanOrEqual(1);
    for (const k of kits) expect(k.n).toBeGreaterThan(0);
  });

  it('creates nothing new when run again', async () => {
    const before = rowCounts();
    const again = await seedDemo(db);
    expect(again.created).toBe(false);
    expect(Object.values(again.inserted).every((n) => n === 0)).toBe(true);
    expect(rowCounts()).toEqual(before);
  });

  it('leaves a consistent database: integrity check ok, no foreign key violations', () => {
    expect(db.$client.pragma('integrity_check', { simple: true })).toBe('ok');
    expect(db.$client.pragma('foreign_key_check')).toEqual([]);
  });
});

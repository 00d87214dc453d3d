import { beforeEach, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { createTestDb } from '@/db/test-db';
import type { Db } from '@/db/connection';
import type { Actor } from '@/db/gear';
import { storedRatios } from '@/db/gear';
import { gearItems, specs, type RecordState } from '@/db/schema';
import { createUser } from '@/db/users';
import { getFieldTestView, listItemFieldTests, listOwnFieldTests } from '@/db/field-tests-view';
import { transitionFieldTest } from '@/db/field-tests';
import {
  handleCreateFieldTest,
  handleGetFieldTest,
  handleReadingsUpload,
  handleTransition,
  handleTrialDelete,
  handleTypedTrial,
  handleUpdateFieldTest,
} from '@/app/api/v1/field-tests/handlers';
import { lightRuntime } from '@/lib/measure';

/*
 * Field tests end to end through the route handlers: CSV fixtures with answers exact by hand
 * (tests/unit/field-test-analysis.test.ts works them out), malformed files refused with nothing
 * stored, the workflow, and who may see or change what (security-tests.md AC-02, CS-01/03, UP-02).
 */

const ORIGIN = 'http://localhost:3000';
let db: Db;
let u: Record<'author' | 'other' | 'editor' | 'editor2' | 'reader', Actor>;

const fixture = (name: string) => readFileSync(fileURLToPath(new URL(`../fixtures/readings/${name}`, import.meta.url)));

function addItem(slug: string, category: string, ownerId: string, opts: { public?: boolean; claims?: Record<string, number> } = {}) {
  const id = `item-${slug}`;
  const at = new Date('2026-09-01T00:00:00Z');
  db.insert(gearItems)
    .values({ id, slug, ownerId, name: slug.replace(/-/g, ' '), maker: 'Northcairn', category, status: opts.public === false ? 'draft' : 'approved', approvedAt: opts.public === false ? null : at, priceMinor: 4000, priceCurrency: 'USD', createdAt: at, updatedAt: at })
    .run();
  for (const [key, value] of Object.entries(opts.claims ?? {})) {
    db.insert(specs).values({ id: `${id}-${key}`, gearItemId: id, key, mode: '', basis: 'claimed', value, claimSource: 'packaging' }).run();
  }
  return id;
}

const json = (method: string, path: string, body: unknown, headers: Record<string, string> = {}) =>
  new Request(`${ORIGIN}${path}`, { method, headers: { 'content-type': 'application/json', origin: ORIGIN, ...headers }, body: typeof body === 'string' ? body : JSON.stringify(body) });

function record(over: Record<string, unknown> = {}) {
  return { kind: 'light-runtime', testedAt: '2026-09-08T18:00', placeLabel: 'Lakeshore test bench', sky: 'indoor', ambientC: 19.5, instruments: [{ name: 'Logging lux meter', accuracy: '±4 %' }], methodNotes: 'Lantern on high in a closed box.', items: ['lantern'], ...over };
}

async function create(user: Actor | null, over: Record<string, unknown> = {}) {
  const res = await handleCreateFieldTest(db, user, json('POST', '/api/v1/field-tests', record(over)));
  return { res, body: (await res.json()) as { fieldTest?: { id: string }; error?: { code: string; message: string; fields?: Record<string, string[]> } } };
}

async function newTest(user: Actor = u.author, over: Record<string, unknown> = {}) {
  const { res, body } = await create(user, over);
  expect(res.status).toBe(201);
  return body.fieldTest!.id;
}

function csvForm(file: Blob | null, name: string, fields: Record<string, string> = {}) {
  const form = new FormData();
  if (file) form.set('file', file, name);
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  return form;
}

async function upload(user: Actor | null, id: string, bytes: Uint8Array | string, name: string, fields: Record<string, string> = { item: 'lantern', label: 'Trial 1' }, opts: { maxBytes?: number; headers?: Record<string, string> } = {}) {
  const body = csvForm(new Blob([typeof bytes === 'string' ? bytes : new Uint8Array(bytes)]), name, fields);
  const req = new Request(`${ORIGIN}/api/v1/field-tests/${id}/readings`, { method: 'POST', body, headers: { origin: ORIGIN, ...opts.headers } });
  const res = await handleReadingsUpload(db, user, id, req, { maxBytes: opts.maxBytes });
  return { status: res.status, body: (await res.json()) as { trial?: { id: string; rows: number; notes: string[] }; error?: { code: string; message: string; fields?: Record<string, string[]> } } };
}

async function act(user: Actor | null, id: string, action: string, comment?: string) {
  const res = await handleTransition(db, user, id, json('POST', `/api/v1/field-tests/${id}/transitions`, { action, comment }));
  return { status: res.status, body: (await res.json()) as { fieldTest?: { status: RecordState }; error?: { message: string } } };
}

const TABLES = ['field_tests', 'field_test_items', 'trials', 'field_test_state_events', 'specs', 'spec_changes', 'gear_ratios', 'gear_figure_notes'];
const counts = () => Object.fromEntries(TABLES.map((t) => [t, (db.$client.prepare(`select count(*) as n from ${t}`).get() as { n: number }).n]));
const measured = (itemId: string, key: string) =>
  db.$client.prepare("select value, sd, n, field_test_id as fieldTestId from specs where gear_item_id = ? and key = ? and basis = 'measured'").get(itemId, key) as
    | { value: number; sd: number | null; n: number; fieldTestId: string }
    | undefined;

let lanternId: string;
let bankId: string;

beforeEach(() => {
  db = createTestDb().db;
  const make = (key: string, role: Actor['role']) => {
    const user = createUser(db, { email: `${key}@example.org`, name: key, passwordHash: null, role });
    return { id: user.id, role: user.role };
  };
  u = { author: make('author', 'reviewer'), other: make('other', 'reviewer'), editor: make('editor', 'editor'), editor2: make('editor2', 'editor'), reader: make('reader', 'reader') };
  // Invented items; rated energy 22.2 Wh = 6000 mAh × 3.7 V (49 CFR 171.8, Wh = Ah × V).
  lanternId = addItem('lantern', 'light', u.author.id, { claims: { mass: 400, luminousFlux: 300, runtime: 30_000 } });
  bankId = addItem('bank', 'power-bank', u.author.id, { claims: { mass: 200, ratedEnergy: 22.2 } });
  addItem('panel', 'solar-panel', u.author.id, { claims: { ratedPower: 60, mass: 1900 } });
  addItem('secret-draft', 'light', u.other.id, { public: false });
});

describe('CSV fixtures → stored results equal closed-form answers', () => {
  it('lantern fade: runtime 34 800 s becomes the measured runtime on approval, with ratios recomputed', async () => {
    const id = await newTest();
    const up = await upload(u.author, id, fixture('lantern-fade.csv'), 'lantern-fade.csv');
    expect(up.status).toBe(201);
    expect(up.body.trial!.rows).toBe(38);
    expect(measured(lanternId, 'runtime')).toBeUndefined(); // nothing measured before approval
    expect((await act(u.author, id, 'submit')).body.fieldTest!.status).toBe('in-review');
    const ratiosBefore = storedRatios(db, lanternId).length;
    const approved = await act(u.editor, id, 'approve');
    expect(approved.status).toBe(200);
    // Reference at 30 s = 400 lx; 10 % = 40 lx reached on the fade 300·(1 − (t − 3600)/36 000) at t = 34 800 s (exact by hand).
    expect(measured(lanternId, 'runtime')).toEqual({ value: 34_800, sd: null, n: 1, fieldTestId: id });
    const ratios = storedRatios(db, lanternId);
    expect(ratios.length).toBeGreaterThanOrEqual(ratiosBefore);
    expect(ratios.length).toBeGreaterThan(0);
    // The stored series holds every row: the runtime from the decoded series equals lib/measure on the file.
    const view = getFieldTestView(db, id, null);
    expect(view.public).toBe(true);
    expect(view.trials[0]!.rows).toBe(38);
    expect(view.analysis.items[0]!.summaries.find((s) => s.key === 'runtime')!.summary.mean).toBe(34_800);
    expect(view.events.length).toBe(0); // events are for insiders only
    expect(getFieldTestView(db, id, u.author).events.map((e) => e.toState)).toEqual(['approved', 'in-review', 'draft']);
  });

  it('bank discharge (V × mA): 20 + 49/600 Wh delivered', async () => {
    const id = await newTest(u.author, { kind: 'energy-delivered', items: ['bank'] });
    expect((await upload(u.author, id, fixture('bank-discharge.csv'), 'bank-discharge.csv', { item: 'bank', label: 'USB-A' })).status).toBe(201);
    await act(u.author, id, 'submit');
    await act(u.editor, id, 'approve');
    // P = V × I falls 10.2 → 9.8 W over 2 h (20 Wh, the trapezoid is exact on a line), then 9.8 → 0 W in 60 s: 49/600 Wh.
    expect(measured(bankId, 'deliveredEnergy')!.value).toBeCloseTo(20 + 49 / 600, 10);
    const view = getFieldTestView(db, id, null);
    const ratio = view.trials[0]!.analysis.ok && view.trials[0]!.analysis.figures.find((f) => f.key === 'deliveredVsRated');
    expect(ratio && ratio.value).toBeCloseTo((20 + 49 / 600) / 22.2, 10);
  });

  it('panel under cloud with clock times: rows before switch-on dropped with a note; mean 30 W = 0.5 of 60 W', async () => {
    const id = await newTest(u.author, { kind: 'solar-output', sky: 'broken-cloud', ambientC: 17, items: ['panel'] });
    const up = await upload(u.author, id, fixture('panel-cloud.csv'), 'panel-cloud.csv', { item: 'panel', label: 'Midday', switchOn: '2026-09-19 11:00:00' });
    expect(up.status).toBe(201);
    expect(up.body.trial!.notes).toContain('3 rows were before switch-on and left out.');
    const view = getFieldTestView(db, id, u.author);
    expect(view.trials[0]!.notes).toContain('3 rows were before switch-on and left out.');
    expect(view.trials[0]!.seriesMeta?.droppedBeforeSwitchOn).toBe(3);
    const a = view.trials[0]!.analysis;
    // Trapezoids from 11:00 give 900 W·min over 30 min = 30 W; peak 40 W (exact by hand).
    expect(a.ok && a.figures.find((f) => f.key === 'meanPower')!.value).toBeCloseTo(30, 12);
    expect(a.ok && a.figures.find((f) => f.key === 'shareOfRating')!.value).toBeCloseTo(0.5, 12);
  });

  it('repeated trials give mean ± sd (n); typed readings are a series too', async () => {
    const id = await newTest();
    await upload(u.author, id, fixture('lantern-fade.csv'), 'lantern-fade.csv');
    // Typed-in: flat 100 to 30 s, then a straight fade to 0 at 1030 s; 10 % (10) is reached at 1030 − 1000 × 0.1 = 930 s (exact by hand).
    const typed = {
      item: 'lantern',
      label: 'Typed',
      timeUnit: 's',
      fields: ['value'],
      entries: [
        { time: '0', value: '100' },
        { time: '30', value: '100' },
        { time: '1030', value: '0' },
      ],
    };
    const res = await handleReadingsUpload(db, u.author, id, json('POST', `/api/v1/field-tests/${id}/readings`, typed));
    expect(res.status).toBe(201);
    await act(u.author, id, 'submit');
    await act(u.editor, id, 'approve');
    const m = measured(lanternId, 'runtime')!;
    expect(m.n).toBe(2);
    expect(m.value).toBeCloseTo((34_800 + 930) / 2, 9);
    expect(m.sd).toBeCloseTo((34_800 - 930) / Math.SQRT2, 6); // sample sd of two values = |a − b| / √2
  });

  it('100 000 generated rows parse and save, and every row is used', async () => {
    const lines = ['t_s,lux'];
    // 100 at t ≤ 30 s, then a straight fade reaching 0 at 100 000 s: 10 % at 100 000 − 99 970 × 0.1 = 90 003 s.
    for (let t = 0; t < 100_000; t += 1) lines.push(`${t},${t <= 30 ? 100 : Number(((100 * (100_000 - t)) / 99_970).toFixed(4))}`);
    const id = await newTest();
    const up = await upload(u.author, id, lines.join('\n'), 'big.csv');
    expect(up.status).toBe(201);
    expect(up.body.trial!.rows).toBe(100_000);
    const view = getFieldTestView(db, id, u.author);
    expect(view.trials[0]!.chartSamples.length).toBeLessThanOrEqual(2000);
    expect(view.trials[0]!.seriesBytes).toBeLessThan(100_000 * 6);
    const full = lightRuntime(lines.slice(1).map((l) => ({ t: Number(l.split(',')[0]), value: Number(l.split(',')[1]) }))).runtimeS!;
    const a = view.trials[0]!.analysis;
    expect(a.ok && a.figures.find((f) => f.key === 'runtime')!.value).toBe(full);
    expect(full).toBeCloseTo(90_003, 0);
  });
});

describe('malformed files: clear errors, nothing stored', () => {
  const cases: [string, number, RegExp][] = [
    ['missing-column.csv', 422, /column of readings/],
    ['no-time-column.csv', 422, /No column looks like time/],
    ['text-in-numbers.csv', 422, /Row 4: 'n\/a' is not a number/],
    ['unsorted-times.csv', 422, /time goes backwards at row 5/i],
    ['empty.csv', 422, /empty/i],
    ['binary-renamed.csv', 415, /./],
  ];
  for (const [name, status, message] of cases) {
    it(`${name} → ${status}`, async () => {
      const id = await newTest();
      const before = counts();
      const r = await upload(u.author, id, fixture(name), name);
      expect(r.status).toBe(status);
      expect(r.body.error!.message).toMatch(message);
      expect(JSON.stringify(r.body)).not.toMatch(/Sqlite|at \/|stack/);
      expect(counts()).toEqual(before);
    });
  }

  it('row errors come back as fields, and the named rows can be left out', async () => {
    const id = await newTest();
    const r = await upload(u.author, id, fixture('text-in-numbers.csv'), 'text-in-numbers.csv');
    expect(r.body.error!.fields!.rows).toEqual(["row 4: 'n/a' is not a number (lux)"]);
    expect(r.body.error!.fields!.dropRows).toEqual(['4']);
    const again = await upload(u.author, id, fixture('text-in-numbers.csv'), 'text-in-numbers.csv', { item: 'lantern', label: 'T', dropRows: '4' });
    expect(again.status).toBe(201);
    expect(again.body.trial!.rows).toBe(3);
  });

  it('a file over the byte cap → 413 from Content-Length, and from the real size of a chunked body', async () => {
    const id = await newTest();
    const before = counts();
    const big = 'time_s,lux\n' + '1,1\n'.repeat(300_000); // 1.2 MB, cap 1 MB here
    const declared = await upload(u.author, id, big, 'big.csv', { item: 'lantern' }, { maxBytes: 1024 * 1024, headers: { 'content-length': String(50 * 1024 * 1024) } });
    expect(declared.status).toBe(413);
    // No Content-Length: a streamed body is cut off as soon as it passes the cap.
    const chunk = new TextEncoder().encode('x'.repeat(64 * 1024));
    let sent = 0;
    const stream = new ReadableStream<Uint8Array>({
      pull(controller) {
        sent += chunk.length;
        if (sent > 40 * 1024 * 1024) controller.close();
        else controller.enqueue(chunk);
      },
    });
    const req = new Request(`${ORIGIN}/api/v1/field-tests/${id}/readings`, { method: 'POST', body: stream, headers: { origin: ORIGIN, 'content-type': 'multipart/form-data; boundary=x' }, duplex: 'half' } as RequestInit);
    const res = await handleReadingsUpload(db, u.author, id, req, { maxBytes: 1024 * 1024 });
    expect(res.status).toBe(413);
    expect(sent).toBeLessThan(4 * 1024 * 1024); // stopped reading early
    expect(counts()).toEqual(before);
  });

  it('a non-CSV name or a non-multipart body → 415', async () => {
    const id = await newTest();
    expect((await upload(u.author, id, fixture('lantern-fade.csv'), 'lantern.png')).status).toBe(415);
    const req = new Request(`${ORIGIN}/api/v1/field-tests/${id}/readings`, { method: 'POST', body: 'time,lux\n0,1', headers: { origin: ORIGIN, 'content-type': 'text/plain' } });
    expect((await handleReadingsUpload(db, u.author, id, req)).status).toBe(415);
  });

  it('a series for the wrong kind, or for an item not in the test → 422', async () => {
    const id = await newTest();
    expect((await upload(u.author, id, fixture('bank-discharge.csv'), 'bank.csv', { item: 'lantern' })).status).toBe(422);
    expect((await upload(u.author, id, fixture('lantern-fade.csv'), 'lantern.csv', { item: 'bank' })).status).toBe(422);
  });

  it('bad records: GPS coordinates, unknown items, someone else’s draft item → 422 and nothing written', async () => {
    const before = counts();
    const gps = await create(u.author, { placeLabel: '51.5074, -0.1278' });
    expect(gps.res.status).toBe(422);
    expect(gps.body.error!.fields!.placeLabel![0]).toMatch(/not coordinates/);
    expect((await create(u.author, { items: ['no-such-item'] })).res.status).toBe(422);
    expect((await create(u.author, { items: ['secret-draft'] })).res.status).toBe(422);
    expect((await create(u.author, { kind: 'bogus' })).res.status).toBe(422);
    expect(counts()).toEqual(before);
  });
});

describe('workflow', () => {
  it('submit needs trials; author cannot approve; request-changes needs a comment; locked while in review', async () => {
    const id = await newTest();
    expect((await act(u.author, id, 'submit')).status).toBe(422);
    await upload(u.author, id, fixture('lantern-fade.csv'), 'lantern-fade.csv');
    expect((await act(u.author, id, 'approve')).status).toBe(403);
    expect((await act(u.author, id, 'submit')).status).toBe(200);
    expect((await upload(u.author, id, fixture('lantern-fade.csv'), 'again.csv')).status).toBe(409);
    expect((await act(u.editor, id, 'request-changes', '  ')).status).toBe(422);
    expect((await act(u.editor, id, 'request-changes', 'Add a second trial.')).body.fieldTest!.status).toBe('changes-requested');
    expect((await upload(u.author, id, fixture('lantern-fade.csv'), 'again.csv')).status).toBe(201);
    expect((await act(u.author, id, 'submit')).status).toBe(200);
    expect((await act(u.author, id, 'withdraw')).body.fieldTest!.status).toBe('draft');
    const view = getFieldTestView(db, id, u.author);
    expect(view.events.find((e) => e.toState === 'changes-requested')!.comment).toBe('Add a second trial.');
  });

  it('an editor who authored the test cannot approve it', async () => {
    const id = await newTest(u.editor);
    await upload(u.editor, id, fixture('lantern-fade.csv'), 'lantern-fade.csv');
    await act(u.editor, id, 'submit');
    expect((await act(u.editor, id, 'approve')).status).toBe(403);
    expect((await act(u.editor2, id, 'approve')).status).toBe(200);
  });

  it('the latest approved test of a kind wins; the earlier test stays linked to the item', async () => {
    const later = await newTest(u.author, { testedAt: '2026-10-01T18:00' });
    await upload(u.author, later, fixture('lantern-fade.csv'), 'lantern-fade.csv');
    await act(u.author, later, 'submit');
    await act(u.editor, later, 'approve');
    const earlier = await newTest(u.author, { testedAt: '2026-09-01T18:00' });
    await handleReadingsUpload(db, u.author, earlier, json('POST', '/x', { item: 'lantern', timeUnit: 's', fields: ['value'], entries: [{ time: '0', value: '100' }, { time: '30', value: '100' }, { time: '1030', value: '0' }] }));
    await act(u.author, earlier, 'submit');
    await act(u.editor, earlier, 'approve');
    expect(measured(lanternId, 'runtime')).toMatchObject({ value: 34_800, fieldTestId: later });
    expect(listItemFieldTests(db, lanternId, null).map((t) => t.id)).toEqual([later, earlier]);
  });

  it('typed trials (mass check) give a measured mass; deleting a trial works only on drafts', async () => {
    const id = await newTest(u.author, { kind: 'mass-check', items: ['lantern'] });
    const add = (mass: number) => handleTypedTrial(db, u.author, id, json('POST', '/x', { item: 'lantern', label: 'W', typedValues: { mass } }));
    expect((await add(428)).status).toBe(201);
    const extra = (await (await add(999)).json()) as { trial: { id: string } };
    expect((await handleTypedTrial(db, u.author, id, json('POST', '/x', { item: 'lantern', typedValues: { runtime: 5 } }))).status).toBe(422);
    expect((await handleTrialDelete(db, u.author, id, extra.trial.id, new Request(`${ORIGIN}/x`, { method: 'DELETE', headers: { origin: ORIGIN } }))).status).toBe(204);
    await act(u.author, id, 'submit');
    expect((await handleTrialDelete(db, u.author, id, extra.trial.id, new Request(`${ORIGIN}/x`, { method: 'DELETE', headers: { origin: ORIGIN } }))).status).toBe(409);
    await act(u.editor, id, 'approve');
    expect(measured(lanternId, 'mass')).toMatchObject({ value: 428, n: 1, fieldTestId: id });
  });
});

describe('who may see and change a field test (AC-02, CS-01, CS-03)', () => {
  it('a draft answers 404 to other reviewers, readers and anonymous; the item owner and editors see it', async () => {
    const id = await newTest();
    for (const who of [null, u.reader, u.other]) expect((await handleGetFieldTest(db, who, id)).status).toBe(404);
    expect((await handleGetFieldTest(db, u.editor, id)).status).toBe(200);
    // Someone else's test of the author's item: the item owner sees it before approval.
    const theirs = await newTest(u.other);
    expect((await handleGetFieldTest(db, u.author, theirs)).status).toBe(200);
    expect((await handleGetFieldTest(db, u.reader, theirs)).status).toBe(404);
  });

  it('ids copied from another reviewer’s responses get 404/403, and nothing changes', async () => {
    const id = await newTest();
    await upload(u.author, id, fixture('lantern-fade.csv'), 'lantern-fade.csv');
    const trialId = getFieldTestView(db, id, u.author).trials[0]!.id;
    const before = counts();
    expect((await upload(u.other, id, fixture('lantern-fade.csv'), 'x.csv')).status).toBe(404);
    expect((await handleUpdateFieldTest(db, u.other, id, json('PATCH', '/x', record({ placeLabel: 'Hijacked' })))).status).toBe(404);
    expect((await handleTrialDelete(db, u.other, id, trialId, new Request(`${ORIGIN}/x`, { method: 'DELETE', headers: { origin: ORIGIN } }))).status).toBe(404);
    expect((await act(u.other, id, 'submit')).status).toBe(404);
    // An editor sees it but may not change someone else's draft.
    expect((await upload(u.editor, id, fixture('lantern-fade.csv'), 'x.csv')).status).toBe(403);
    expect((await handleUpdateFieldTest(db, u.editor, id, json('PATCH', '/x', record({ placeLabel: 'Edited' })))).status).toBe(403);
    expect((await upload(null, id, fixture('lantern-fade.csv'), 'x.csv')).status).toBe(401);
    // A trial id of another test does not resolve through this one.
    const mine = await newTest(u.other, { items: ['lantern'] });
    expect((await handleTrialDelete(db, u.other, mine, trialId, new Request(`${ORIGIN}/x`, { method: 'DELETE', headers: { origin: ORIGIN } }))).status).toBe(404);
    const after = counts();
    expect({ ...after, field_tests: before.field_tests, field_test_items: before.field_test_items, field_test_state_events: before.field_test_state_events }).toEqual(before);
  });

  it('an approved test of an item that is not public answers 404 to the public', async () => {
    addItem('hidden', 'light', u.author.id, { public: false });
    const id = await newTest(u.author, { items: ['hidden'] });
    await upload(u.author, id, fixture('lantern-fade.csv'), 'lantern-fade.csv', { item: 'hidden' });
    await act(u.author, id, 'submit');
    await act(u.editor, id, 'approve');
    expect((await handleGetFieldTest(db, null, id)).status).toBe(404);
    expect((await handleGetFieldTest(db, u.author, id)).status).toBe(200);
    expect(() => transitionFieldTest(db, u.reader, id, 'approve')).toThrow(/No field test/);
  });

  it('JSON routes refuse text/plain, form posts and cross-site origins (415 / 403), writing nothing', async () => {
    const before = counts();
    const body = JSON.stringify(record());
    const plain = await handleCreateFieldTest(db, u.author, new Request(`${ORIGIN}/api/v1/field-tests`, { method: 'POST', body, headers: { 'content-type': 'text/plain', origin: ORIGIN } }));
    expect(plain.status).toBe(415);
    const form = await handleCreateFieldTest(db, u.author, new Request(`${ORIGIN}/api/v1/field-tests`, { method: 'POST', body: 'kind=x', headers: { 'content-type': 'application/x-www-form-urlencoded', origin: ORIGIN } }));
    expect(form.status).toBe(415);
    const none = await handleCreateFieldTest(db, u.author, new Request(`${ORIGIN}/api/v1/field-tests`, { method: 'POST', body, headers: { origin: ORIGIN } }));
    expect(none.status).toBe(415);
    const cross = await handleCreateFieldTest(db, u.author, json('POST', '/api/v1/field-tests', record(), { origin: 'https://evil.example' }));
    expect(cross.status).toBe(403);
    expect((await handleCreateFieldTest(db, u.reader, json('POST', '/api/v1/field-tests', record()))).status).toBe(403);
    expect((await handleCreateFieldTest(db, null, json('POST', '/api/v1/field-tests', record()))).status).toBe(401);
    expect(counts()).toEqual(before);
  });

  it('the logbook lists only the signed-in reviewer’s own tests', async () => {
    const mine = await newTest();
    await newTest(u.other);
    expect(listOwnFieldTests(db, u.author.id).map((t) => t.id)).toEqual([mine]);
  });
});

describe('demo seed', () => {
  it('stores its field tests as series that the field-test pages analyse to the seeded measured figures', async () => {
    const { seedDemo } = await import('@/db/seed');
    await seedDemo(db);
    const approved = db.$client.prepare("select id from field_tests where id like 'demo-ft-%' and status = 'approved'").all() as { id: string }[];
    expect(approved.length).toBeGreaterThanOrEqual(3);
    for (const { id } of approved) {
      const view = getFieldTestView(db, id, null);
      expect(view.trials.every((t) => t.analysis.ok)).toBe(true);
      for (const item of view.analysis.items) {
        for (const s of item.summaries.filter((x) => x.specKey)) {
          const m = measured(item.itemId, s.specKey!);
          if (m?.fieldTestId === id) expect(m.value).toBeCloseTo(s.summary.mean, 9);
        }
      }
    }
  });
});

/**
 * Ports on gear items (issues 4 and 9): stored through the same service, schema, API and actions as
 * claimed specs; a draft's ports change live, an approved item's ports wait with its pending change;
 * history in words; bad ports → 422 naming the field and nothing stored; portsOfGear → approved only.
 *
 * USB PD figures used below are the Standard Power Range fixed profiles at 3 A (5, 9, 15, 20 V →
 * 15, 27, 45, 60 W; USB PD Rev 3.x, ../shared/reference/check-values.md §7); the 48 V / 5 A ceiling is
 * the Extended Power Range of USB PD Rev 3.1 (same section).
 */
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { createSessionUser, dbMock, guardMock, navigationMock, type SessionUser } from '../support/integration-mocks';
import { getTableName } from 'drizzle-orm';
import { createTestDb } from '@/db/test-db';
import type { Db } from '@/db/connection';
import { gearItems, gearPendingChanges, gearPorts, specChanges, specs, type Role } from '@/db/schema';
import { AppError } from '@/lib/http/errors';

const state = vi.hoisted(() => ({ db: null as unknown as Db, user: null as SessionUser | null }));
vi.mock('@/db', () => dbMock(() => state.db));
vi.mock('next/navigation', () => navigationMock());
vi.mock('@/lib/auth/guard', () => guardMock(() => state.user));

const { approveGear, createGear, getGearView, specHistory, submitGear, updateGear, workingCopy } = await import('@/db/gear');
const { portsOfGear } = await import('@/db/gear-ports');
const { POST } = await import('@/app/api/v1/gear/route');
const { GET: GET_ONE, PATCH } = await import('@/app/api/v1/gear/[slug]/route');
const { createGearAction, updateGearAction } = await import('@/lib/gear/actions');

type U = SessionUser;
let author: U;
let editor: U;

const count = (table: typeof gearItems | typeof specs | typeof specChanges | typeof gearPendingChanges | typeof gearPorts) =>
  (state.db.$client.prepare(`select count(*) as n from ${getTableName(table)}`).get() as { n: number }).n;
const counts = () => [gearItems, specs, specChanges, gearPendingChanges, gearPorts].map(count);

const bank = (ports: unknown[]) => ({
  category: 'power-bank',
  name: 'Test Bank 20',
  maker: 'Voltmoth',
  chemistry: 'li-ion',
  specs: { mass: { value: '350 g' }, ratedEnergy: { value: '72 Wh' } },
  ports,
});
const usbCOut = { kind: 'usb-c', direction: 'output', watts: 45, pdProfiles: [{ volts: 5, amps: 3 }, { volts: 9, amps: 3 }, { volts: 15, amps: 3 }] };
const usbAOut = { kind: 'usb-a', direction: 'output', volts: 5, amps: 2.4, watts: 12 };
const usbCIn = { kind: 'usb-c', direction: 'input', watts: 30, pdProfiles: '5 V 3 A · 9 V 3 A' };

const BASE = 'http://localhost:3000';
const json = (method: string, path: string, body: unknown) =>
  new Request(`${BASE}${path}`, { method, headers: { 'content-type': 'application/json', origin: BASE }, body: typeof body === 'string' ? body : JSON.stringify(body) });
const params = (slug: string) => ({ params: Promise.resolve({ slug }) });

async function publicPorts(slug: string) {
  state.user = null;
  const res = await GET_ONE(new Request(`${BASE}/api/v1/gear/${slug}`), params(slug));
  expect(res.status).toBe(200);
  return ((await res.json()) as { ports?: unknown[] }).ports;
}

function approve(slug: string) {
  submitGear(state.db, author, slug);
  approveGear(state.db, editor, slug);
}

beforeEach(() => {
  state.db = createTestDb().db;
  const make = (key: string, role: Role) => createSessionUser(state.db, key, role);
  author = make('author', 'reviewer');
  editor = make('editor', 'editor');
  state.user = null;
});

describe('creating and editing ports', () => {
  it('stores ports in order with their claim source, PD profiles typed as text parsed to V/A pairs', () => {
    const { id, slug } = createGear(state.db, author, { ...bank([usbCOut, usbAOut, { ...usbCIn, source: 'manual' }]), claimSource: 'makers-site' });
    const copy = workingCopy(state.db, state.db.select().from(gearItems).all()[0]!);
    expect(copy.ports).toEqual([
      { ...usbCOut, source: 'makers-site' },
      { ...usbAOut, source: 'makers-site' },
      { kind: 'usb-c', direction: 'input', watts: 30, pdProfiles: [{ volts: 5, amps: 3 }, { volts: 9, amps: 3 }], source: 'manual' },
    ]);
    // Three ports added → three history lines in words.
    const history = specHistory(state.db, slug, author).filter((h) => h.key.startsWith('Port'));
    expect(history.map((h) => [h.key, h.oldText, h.newText]).sort()).toEqual([
      ['Port 1', null, "USB-C output: 45 W; PD 5 V 3 A · 9 V 3 A · 15 V 3 A (Maker's site)"],
      ['Port 2', null, "USB-A output: 5 V, 2.4 A, 12 W (Maker's site)"],
      ['Port 3', null, 'USB-C input: 30 W; PD 5 V 3 A · 9 V 3 A (Manual)'],
    ]);
    // A draft is not public: portsOfGear gives it no ports.
    expect(portsOfGear(state.db, [id])).toEqual({ [id]: [] });
  });

  it('changes a draft’s ports live, logging the change in words; a patch without ports keeps them', () => {
    const { slug } = createGear(state.db, author, bank([usbCOut]));
    updateGear(state.db, author, slug, { ports: [{ ...usbCOut, pdProfiles: [...usbCOut.pdProfiles, { volts: 20, amps: 3 }], watts: 60 }] });
    expect(count(gearPendingChanges)).toBe(0);
    const rows = state.db.select().from(gearPorts).all();
    expect(rows).toHaveLength(1);
    expect(rows[0]!.pdProfiles).toEqual([{ volts: 5, amps: 3 }, { volts: 9, amps: 3 }, { volts: 15, amps: 3 }, { volts: 20, amps: 3 }]);
    const line = specHistory(state.db, slug, author).find((h) => h.key === 'Port 1' && h.context === 'edit' && h.oldText !== null);
    expect(line?.oldText).toBe('USB-C output: 45 W; PD 5 V 3 A · 9 V 3 A · 15 V 3 A (Packaging)');
    expect(line?.newText).toBe('USB-C output: 60 W; PD 5 V 3 A · 9 V 3 A · 15 V 3 A · 20 V 3 A (Packaging)');

    updateGear(state.db, author, slug, { name: 'Test Bank 20 mk2' });
    expect(state.db.select().from(gearPorts).all()).toHaveLength(1);

    updateGear(state.db, author, slug, { ports: [] });
    expect(state.db.select().from(gearPorts).all()).toHaveLength(0);
    const removed = specHistory(state.db, slug, author).find((h) => h.key === 'Port 1' && h.newText === null);
    expect(removed?.oldText).toContain('USB-C output: 60 W');
  });

  it('keeps an approved item’s ports public until its edit is approved, then applies and notes it', async () => {
    const { id, slug } = createGear(state.db, author, bank([usbCOut, usbAOut]));
    approve(slug);
    expect(portsOfGear(state.db, [id])[id]).toEqual([
      { kind: 'usb-c', direction: 'output', watts: 45, pdProfiles: usbCOut.pdProfiles },
      { kind: 'usb-a', direction: 'output', volts: 5, amps: 2.4, watts: 12 },
    ]);

    const result = updateGear(state.db, author, slug, { ports: [usbCOut, usbCIn], changeNote: 'Input port added from the manual' });
    expect(result.pending).toBe(true);
    // Readers still get the approved ports, the author sees the pending ones.
    expect(portsOfGear(state.db, [id])[id]!.map((p) => `${p.kind} ${p.direction}`)).toEqual(['usb-c output', 'usb-a output']);
    expect((await publicPorts(slug))?.map((p) => (p as { kind: string }).kind)).toEqual(['usb-c', 'usb-a']);
    expect(getGearView(state.db, slug, author).version.ports.map((p) => `${p.kind} ${p.direction}`)).toEqual(['usb-c output', 'usb-c input']);
    expect(getGearView(state.db, slug, null).version.ports.map((p) => `${p.kind} ${p.direction}`)).toEqual(['usb-c output', 'usb-a output']);
    const pendingLine = specHistory(state.db, slug, author).find((h) => h.context === 'pending');
    expect(pendingLine).toMatchObject({ key: 'Port 2', oldText: 'USB-A output: 5 V, 2.4 A, 12 W (Packaging)', newText: 'USB-C input: 30 W; PD 5 V 3 A · 9 V 3 A (Packaging)' });

    approve(slug);
    expect(portsOfGear(state.db, [id])[id]!.map((p) => `${p.kind} ${p.direction}`)).toEqual(['usb-c output', 'usb-c input']);
    expect(specHistory(state.db, slug, editor).some((h) => h.context === 'approval' && h.key === 'Port 2')).toBe(true);
    const note = getGearView(state.db, slug, null).notes[0];
    expect(note?.summary).toContain('Port 2: USB-A output: 5 V, 2.4 A, 12 W (Packaging) → USB-C input');
    expect(note?.note).toBe('Input port added from the manual');
  });

  it('portsOfGear answers every id asked for: approved ports, empty for drafts, unknown ids and items without ports', () => {
    const a = createGear(state.db, author, bank([usbAOut]));
    const b = createGear(state.db, author, { ...bank([]), name: 'Portless' });
    const c = createGear(state.db, author, { ...bank([usbCOut]), name: 'Still a draft' });
    approve(a.slug);
    approve(b.slug);
    expect(portsOfGear(state.db, [a.id, b.id, c.id, 'nope', a.id])).toEqual({
      [a.id]: [{ kind: 'usb-a', direction: 'output', volts: 5, amps: 2.4, watts: 12 }],
      [b.id]: [],
      [c.id]: [],
      nope: [],
    });
    expect(portsOfGear(state.db, [])).toEqual({});
  });
});

describe('bad ports: 422 naming the field, nothing stored', () => {
  const cases: [string, unknown, string, RegExp][] = [
    ['PD profiles on a USB-A port', { ...usbAOut, pdProfiles: [{ volts: 9, amps: 2 }] }, 'ports.0.pdProfiles', /Only USB-C/],
    ['negative volts', { ...usbAOut, volts: -5 }, 'ports.0.volts', /greater than 0/],
    ['volts as words', { ...usbAOut, volts: 'five' }, 'ports.0.volts', /number of V/],
    ['an "other" port without a label', { kind: 'other', direction: 'output', volts: 12 }, 'ports.0.label', /Name the connector/],
    ['a window with min above max', { kind: 'solar-input', direction: 'input', voltageWindow: { minVolts: 22, maxVolts: 12 } }, 'ports.0.voltageWindow.maxVolts', /not be below/],
    ['a window with one end only', { kind: 'genderless-dc', direction: 'input', voltageWindow: { minVolts: 11 } }, 'ports.0.voltageWindow.maxVolts', /highest/],
    ['a window on an output', { kind: 'genderless-dc', direction: 'output', volts: 12, voltageWindow: { minVolts: 11, maxVolts: 15 } }, 'ports.0.voltageWindow', /Only an input/],
    ['a solar input used as an output', { kind: 'solar-input', direction: 'output' }, 'ports.0.direction', /always an input/],
    // 48 V and 5 A are the USB PD Rev 3.1 EPR ceilings (check-values §7).
    ['a PD profile above 48 V', { kind: 'usb-c', direction: 'output', pdProfiles: [{ volts: 60, amps: 3 }] }, 'ports.0.pdProfiles.0.volts', /48 V/],
    ['a PD profile above 5 A', { kind: 'usb-c', direction: 'output', pdProfiles: [{ volts: 20, amps: 6 }] }, 'ports.0.pdProfiles.0.amps', /5 A/],
    ['unreadable PD text', { kind: 'usb-c', direction: 'output', pdProfiles: '9 volts please' }, 'ports.0.pdProfiles', /Could not read "9 volts please"/],
    ['an unknown kind', { kind: 'usb-b', direction: 'output' }, 'ports.0.kind', /Choose the connector/],
    ['an unknown key', { ...usbAOut, ownerId: 'x' }, 'ports.0', /ownerId|Unrecognized/i],
    ['efficiency above 1', { ...usbAOut, efficiency: 1.5 }, 'ports.0.efficiency', /at most 1/],
  ];

  it.each(cases)('refuses %s through the service', (_what, port, field, message) => {
    const before = counts();
    let error: unknown;
    try {
      createGear(state.db, author, bank([port]));
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(AppError);
    expect((error as AppError).status).toBe(422);
    const fields = (error as AppError).fields ?? {};
    expect(Object.keys(fields)).toContain(field);
    expect(fields[field]!.join(' ')).toMatch(message);
    expect(counts()).toEqual(before);
  });

  it('refuses bad ports through POST and PATCH with 422 and the same field, leaving an approved item as it was', async () => {
    state.user = author;
    let res = await POST(json('POST', '/api/v1/gear', bank([{ ...usbAOut, volts: -5 }])));
    expect(res.status).toBe(422);
    expect((await res.json()).error.fields['ports.0.volts']).toBeDefined();

    const { slug } = createGear(state.db, author, bank([usbCOut]));
    approve(slug);
    const before = counts();
    state.user = author;
    res = await PATCH(json('PATCH', `/api/v1/gear/${slug}`, { ports: [{ kind: 'other', direction: 'input' }] }), params(slug));
    expect(res.status).toBe(422);
    expect((await res.json()).error.fields['ports.0.label']).toBeDefined();
    res = await PATCH(json('PATCH', `/api/v1/gear/${slug}`, { ports: 'usb-c' }), params(slug));
    expect(res.status).toBe(422);
    expect(counts()).toEqual(before);
    expect(state.db.select().from(gearItems).get()?.status).toBe('approved');
  });

  it('creates with ports through POST (201) and the server action, and edits through the action', async () => {
    state.user = author;
    const res = await POST(json('POST', '/api/v1/gear', bank([usbCOut])));
    expect(res.status).toBe(201);
    const action = await createGearAction({ ...bank([usbAOut]), name: 'Action Bank' }).catch((e: { redirectTo?: string }) => e);
    const slug = (action as { redirectTo: string }).redirectTo.split('/').pop()!;
    expect(workingCopy(state.db, state.db.select().from(gearItems).all().find((i) => i.slug === slug)!).ports).toHaveLength(1);
    const refused = await updateGearAction(slug, { ports: [{ ...usbAOut, pdProfiles: '9 V 2 A' }] });
    expect(refused.fields?.['ports.0.pdProfiles']).toBeDefined();
  });
});

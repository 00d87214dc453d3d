import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { dbMock, guardMock, navigationMock, type SessionUser } from '../support/integration-mocks';
import { randomUUID } from 'node:crypto';
import { createTestDb } from '@/db/test-db';
import type { Db } from '@/db/connection';
import { authEvents, capturedEmails, gearItems, reviewRevisions, reviews, reviewStateEvents, type Role } from '@/db/schema';
import { createUser, setUserDisabled } from '@/db/users';
import { listCapturedEmails } from '@/db/outbox';
import { startCaptureServer } from '@/lib/mail/capture-server';
import { useCaptureServer } from '@/lib/mail';

// The actions read the shared connection and the session: point both at this test.
const state = vi.hoisted(() => ({ db: null as unknown as Db, user: null as SessionUser | null }));
vi.mock('@/db', () => dbMock(() => state.db));
vi.mock('next/cache', () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined }));
vi.mock('next/navigation', () => navigationMock());
vi.mock('@/lib/auth/guard', () => guardMock(() => state.user));

const actions = await import('@/lib/reviews/actions');
const { buildNotifications } = await import('@/lib/reviews/notify');

let server: Awaited<ReturnType<typeof startCaptureServer>>;
type U = SessionUser;
const u = {} as Record<'author' | 'editor' | 'editor2' | 'admin' | 'disabledEditor' | 'reader', U>;
let itemId: string;

function user(key: string, role: Role): U {
  const created = createUser(state.db, { email: `${key}@example.test`, name: `Name ${key}`, passwordHash: null, role });
  return { id: created.id, email: created.email, name: created.name, role };
}

async function as<T>(who: U | null, fn: () => Promise<T>): Promise<T | { redirectTo: string }> {
  state.user = who;
  try {
    return await fn();
  } catch (error) {
    if (error && typeof error === 'object' && 'redirectTo' in error) return { redirectTo: String((error as { redirectTo: string }).redirectTo) };
    throw error;
  }
}

const mailsAfter = (id: number) => listCapturedEmails(state.db, 500).filter((m) => m.id > id);
const lastMailId = () => listCapturedEmails(state.db, 1)[0]?.id ?? 0;

/** Mail is sent after the transaction; the capture server stores it asynchronously. */
async function waitForMail(after: number, n: number) {
  for (let i = 0; i < 100 && mailsAfter(after).length < n; i++) await new Promise((r) => setTimeout(r, 30));
  return mailsAfter(after);
}

beforeAll(async () => {
  state.db = createTestDb().db;
  server = await startCaptureServer(state.db);
  useCaptureServer(server.port);
  process.env.AUTH_URL = 'http://trailbench.test:3104';
  u.author = user('author', 'reviewer');
  u.editor = user('editor', 'editor');
  u.editor2 = user('editor2', 'editor');
  u.admin = user('admin', 'admin');
  u.disabledEditor = user('gone', 'editor');
  u.reader = user('reader', 'reader');
  setUserDisabled(state.db, { userId: u.disabledEditor.id, disabled: true, actorId: u.admin.id });
  itemId = randomUUID();
  state.db.insert(gearItems).values({ id: itemId, slug: 'test-lantern', ownerId: u.author.id, name: 'Test Lantern', maker: 'Glowmere', category: 'light' }).run();
});
afterAll(() => server.close());

describe('review workflow mail, through the server actions', () => {
  it('mails editors on submission and the author on each editor decision, with links from AUTH_URL', async () => {
    const created = await as(u.author, () => actions.createReviewAction({ title: 'Hearth lantern <b>test</b>', itemIds: [itemId] }));
    expect(created).toMatchObject({ redirectTo: expect.stringMatching(/^\/write\//) });
    const id = (created as { redirectTo: string }).redirectTo.slice('/write/'.length);
    const text = { title: 'Hearth lantern <b>test</b>', summary: 'Bright.', verdict: 'Good.', body: 'Ran five hours.', disclosure: 'bought-retail', disclosureNote: '', correctionNote: '', itemIds: [itemId] };
    expect(await as(u.author, () => actions.saveReviewDraftAction(id, text))).toMatchObject({ ok: true });

    let mark = lastMailId();
    await as(u.author, () => actions.submitReviewAction(id));
    let mails = await waitForMail(mark, 3);
    // Editors and admins, not the disabled editor, not the author.
    expect(mails.map((m) => m.toAddress).sort()).toEqual([u.admin.email, u.editor.email, u.editor2.email].sort());
    expect(mails[0]?.subject).toBe('Review submitted: Hearth lantern <b>test</b>');
    expect(mails[0]?.textBody).toContain(`http://trailbench.test:3104/desk/reviews/${id}`);
    expect(mails[0]?.htmlBody).toContain('Hearth lantern &lt;b&gt;test&lt;/b&gt;');
    expect(mails[0]?.htmlBody).not.toContain('<b>test</b>');

    mark = lastMailId();
    await as(u.editor, () => actions.requestChangesAction(id, { comment: 'Say which mode you timed.' }));
    mails = await waitForMail(mark, 1);
    expect(mails.map((m) => [m.toAddress, m.subject])).toEqual([[u.author.email, 'Changes requested: Hearth lantern <b>test</b>']]);
    expect(mails[0]?.textBody).toContain('> Say which mode you timed.');
    expect(mails[0]?.textBody).toContain(`http://trailbench.test:3104/write/${id}`);

    await as(u.author, () => actions.saveReviewDraftAction(id, { ...text, body: 'Ran five hours on high.' }));
    mark = lastMailId();
    await as(u.author, () => actions.submitReviewAction(id));
    await waitForMail(mark, 3);

    for (const [who, act, subject] of [
      [u.editor, () => actions.approveReviewAction(id), 'Approved: '],
      [u.editor2, () => actions.publishReviewAction(id), 'Published: '],
      [u.admin, () => actions.retractReviewAction(id, { note: 'The meter was out of calibration.' }), 'Retracted: '],
    ] as const) {
      mark = lastMailId();
      expect(await as(who, act)).toMatchObject({ redirectTo: `/desk/reviews/${id}` });
      mails = await waitForMail(mark, 1);
      expect(mails.map((m) => m.toAddress)).toEqual([u.author.email]);
      expect(mails[0]?.subject.startsWith(subject)).toBe(true);
    }
    expect(mails[0]?.textBody).toContain('The meter was out of calibration.');
    expect(mails[0]?.textBody).toContain('http://trailbench.test:3104/reviews/hearth-lantern-b-test-b');
  });

  it('refuses anonymous and unauthorized calls without writing or mailing, and logs the refusal', async () => {
    const count = (t: typeof reviews | typeof reviewRevisions | typeof reviewStateEvents | typeof capturedEmails) => state.db.select().from(t).all().length;
    const before = [count(reviews), count(reviewRevisions), count(reviewStateEvents), count(capturedEmails)];
    const draft = await as(u.author, () => actions.createReviewAction({ title: 'Private draft', itemIds: [itemId] }));
    const id = (draft as { redirectTo: string }).redirectTo.slice('/write/'.length);
    const afterCreate = [count(reviews), count(reviewRevisions), count(reviewStateEvents), count(capturedEmails)];
    expect(await as(null, () => actions.submitReviewAction(id))).toMatchObject({ ok: false, message: 'Sign in to do this.' });
    expect(await as(null, () => actions.createReviewAction({ title: 'Anon', itemIds: [itemId] }))).toMatchObject({ ok: false });
    expect(await as(u.reader, () => actions.createReviewAction({ title: 'Reader', itemIds: [itemId] }))).toMatchObject({ ok: false, message: 'This needs the reviewer role.' });
    expect(await as(u.reader, () => actions.saveReviewDraftAction(id, { title: 'Hijack' }))).toMatchObject({ ok: false, message: 'No review here, or you may not see it.' });
    expect(await as(u.editor, () => actions.approveReviewAction(id))).toMatchObject({ ok: false }); // a draft: 409
    expect(await as(u.author, () => actions.approveReviewAction(id))).toMatchObject({ ok: false });
    expect(await as(u.editor, () => actions.requestChangesAction(id, { comment: '' }))).toMatchObject({ ok: false, fields: { comment: expect.any(Array) } });
    expect(await as(u.editor, () => actions.publishReviewAction({ not: 'an id' }))).toMatchObject({ ok: false });
    expect([count(reviews), count(reviewRevisions), count(reviewStateEvents), count(capturedEmails)]).toEqual(afterCreate);
    expect(afterCreate).toEqual([before[0]! + 1, before[1]! + 1, before[2]! + 1, before[3]]);
    const denied = state.db.select().from(authEvents).all().filter((e) => e.kind === 'authz-denied');
    expect(denied.some((e) => e.userId === u.reader.id)).toBe(true);
  });

  it('builds no mail for withdraw or a correction, and none to a missing author', () => {
    const outcome = { action: 'withdraw' as const, reviewId: 'r', slug: 's', title: 't', comment: '', revisionNumber: 1 };
    expect(buildNotifications(outcome, { editors: [u.editor], author: u.author }, 'X')).toEqual([]);
    expect(buildNotifications({ ...outcome, action: 'start-correction' }, { editors: [u.editor], author: u.author }, 'X')).toEqual([]);
    expect(buildNotifications({ ...outcome, action: 'publish' }, { editors: [], author: null }, 'X')).toEqual([]);
  });
});

describe('per-user mail switches', () => {
  it('skips editors and authors who turned a mail off, and rejects bad settings without writing', async () => {
    const all = { reviewSubmitted: true, changesRequested: true, approved: true, published: true, retracted: true };
    expect(await as(u.editor2, () => actions.saveNotificationSettingsAction({ ...all, reviewSubmitted: false }))).toMatchObject({ ok: true });
    expect(await as(u.author, () => actions.saveNotificationSettingsAction({ ...all, changesRequested: false }))).toMatchObject({ ok: true });
    expect(await as(u.author, () => actions.saveNotificationSettingsAction({ ...all, approved: 'yes' }))).toMatchObject({ ok: false, fields: { approved: expect.any(Array) } });
    expect(await as(null, () => actions.saveNotificationSettingsAction(all))).toMatchObject({ ok: false, message: 'Sign in to do this.' });

    const created = await as(u.author, () => actions.createReviewAction({ title: 'Switches test', itemIds: [itemId] }));
    const id = (created as { redirectTo: string }).redirectTo.slice('/write/'.length);
    await as(u.author, () =>
      actions.saveReviewDraftAction(id, { title: 'Switches test', summary: 'S.', verdict: 'V.', body: 'B.', disclosure: 'bought-retail', disclosureNote: '', correctionNote: '', itemIds: [itemId] }),
    );
    let mark = lastMailId();
    await as(u.author, () => actions.submitReviewAction(id));
    const mails = await waitForMail(mark, 2);
    await new Promise((r) => setTimeout(r, 300));
    expect(mailsAfter(mark).map((m) => m.toAddress).sort()).toEqual([u.admin.email, u.editor.email].sort());
    expect(mails.length).toBe(2);

    mark = lastMailId();
    await as(u.editor, () => actions.requestChangesAction(id, { comment: 'One more thing.' }));
    await new Promise((r) => setTimeout(r, 500));
    expect(mailsAfter(mark)).toEqual([]);
  });
});

import { beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { createTestDb } from '@/db/test-db';
import type { Db } from '@/db/connection';
import { gearItems, reviewBuyLinks, type Role } from '@/db/schema';
import { createUser } from '@/db/users';
import { createReviewDraft, getReviewDiff, getReviewPage, listPublicReviewSlugs, saveBuyLinks, transitionReview, updateReviewDraft, type Actor } from '@/db/reviews';
import { reviveDates } from '@/db/reviews-cache';
import { expireReviewTags, reviewTag } from '@/db/reviews-cache-tags';
import { AppError } from '@/lib/http/errors';
import { buyLinkRel } from '@/lib/reviews/buy-links';
import { diffRevisions } from '@/lib/reviews/diff';

/*
 * What the cached review pages rest on (db/reviews-cache.ts): the list of public slugs that bounds the
 * cache keys follows publish and retract, the JSON round trip keeps dates, expiring tags is harmless
 * outside a Next request; plus the readers' revision diff and the where-to-buy links of a revision.
 * The cache itself (Next's unstable_cache + revalidateTag) only runs inside Next: tests/e2e/search.spec.ts
 * checks there that a publish shows at once and a retraction removes the review.
 */

let db: Db;
let author: Actor;
let editor: Actor;
let other: Actor;
let itemId: string;

const user = (name: string, role: Role): Actor => ({ id: createUser(db, { email: `${name}@example.test`, name, passwordHash: null, role }).id, role });

const text = (body: string, extra: Record<string, unknown> = {}) => ({
  title: 'Fellbeam on the ridge',
  summary: 'A headlamp for night navigation.',
  verdict: 'Good beam, short runtime.',
  body,
  disclosure: 'loaned-by-maker',
  disclosureNote: 'Northcairn loaned it for two weeks.',
  correctionNote: '',
  itemIds: [itemId],
  ...extra,
});

function publish(id: string) {
  transitionReview(db, author, id, 'submit');
  transitionReview(db, editor, id, 'approve');
  transitionReview(db, editor, id, 'publish');
}

const code = (fn: () => unknown) => {
  try {
    fn();
  } catch (e) {
    return e instanceof AppError ? e.code : 'other';
  }
  return 'none';
};

beforeAll(() => {
  db = createTestDb().db;
  author = user('author', 'reviewer');
  editor = user('editor', 'editor');
  other = user('other', 'reviewer');
  itemId = randomUUID();
  db.insert(gearItems).values({ id: itemId, slug: 'fellbeam', ownerId: author.id, name: 'Fellbeam 350', maker: 'Northcairn', category: 'light', status: 'approved', approvedAt: new Date() }).run();
});

describe('cache support', () => {
  it('public slugs follow publish, correction and retraction (drafts never appear)', () => {
    const { id, slug } = createReviewDraft(db, author, { title: 'Fellbeam on the ridge', itemIds: [itemId] });
    updateReviewDraft(db, author, id, text('It ran 3 h 10 min on high.'));
    expect(listPublicReviewSlugs(db)[slug]).toBeUndefined();
    publish(id);
    expect(listPublicReviewSlugs(db)[slug]).toEqual([1]);
    transitionReview(db, author, id, 'start-correction');
    expect(listPublicReviewSlugs(db)[slug]).toEqual([1]);
    updateReviewDraft(db, author, id, text('It ran 3 h 40 min on high.', { correctionNote: 'Runtime read from the right trial.' }));
    publish(id);
    expect(listPublicReviewSlugs(db)[slug]).toEqual([1, 2]);
    transitionReview(db, editor, id, 'retract', 'Beam figures were from a different unit.');
    expect(listPublicReviewSlugs(db)[slug]).toEqual([1, 2]); // a retracted review keeps its public page, with the note
  });

  it('expiring tags outside a Next request does nothing and does not throw', () => {
    expect(() => expireReviewTags('any-slug')).not.toThrow();
    expect(reviewTag('a')).toBe('review:a');
  });

  it('revives the dates of a page after the JSON round trip of the data cache', () => {
    const { id, slug } = createReviewDraft(db, author, { title: 'Round trip', itemIds: [itemId] });
    updateReviewDraft(db, author, id, text('Body.', { title: 'Round trip' }));
    publish(id);
    const page = getReviewPage(db, slug, null);
    const revived = reviveDates(JSON.parse(JSON.stringify(page)) as typeof page);
    expect(revived).toEqual(page);
    expect(revived.revision.publishedAt).toBeInstanceOf(Date);
    // A cache miss returns the function's own result: its Dates stay Dates.
    expect(reviveDates(page)).toEqual(page);
    // Only date keys are revived: a title that looks like a date stays a string.
    expect(reviveDates({ title: '2026-10-02T08:41:00.000Z' })).toEqual({ title: '2026-10-02T08:41:00.000Z' });
  });
});

describe('revision diff for readers', () => {
  it('compares a public revision with the current one; drafts and unknown revisions are 404', () => {
    const { id, slug } = createReviewDraft(db, author, { title: 'Diffed', itemIds: [itemId] });
    updateReviewDraft(db, author, id, text('It ran for five hours.', { title: 'Diffed' }));
    expect(code(() => getReviewDiff(db, slug, 1))).toBe('not_found'); // nothing public yet
    publish(id);
    transitionReview(db, author, id, 'start-correction');
    updateReviewDraft(db, author, id, text('It ran for six hours.', { title: 'Diffed', correctionNote: 'Six, not five.' }));
    expect(code(() => getReviewDiff(db, slug, 2))).toBe('not_found'); // revision 2 is a draft
    publish(id);
    const d = getReviewDiff(db, slug, 1);
    expect([d.from.number, d.to.number, d.publicNumbers]).toEqual([1, 2, [1, 2]]);
    const body = diffRevisions(d.from.text, d.to.text).find((f) => f.field === 'body')!;
    expect(body.parts.map((p) => `${p.kind}:${p.text}`)).toEqual(['same:It ran for ', 'removed:five', 'added:six', 'same: hours.']);
    expect(code(() => getReviewDiff(db, slug, 9))).toBe('not_found');
    expect(code(() => getReviewDiff(db, 'no-such-review', 1))).toBe('not_found');
  });
});

describe('where-to-buy links', () => {
  it('are saved by the author on a draft, validated, shown with the public revision and copied into a correction', () => {
    const { id, slug } = createReviewDraft(db, author, { title: 'With links', itemIds: [itemId] });
    updateReviewDraft(db, author, id, text('Body.', { title: 'With links' }));
    const links = [
      { label: 'Cedar Hollow outfitters desk', url: 'https://shop.example/fellbeam', isAffiliate: false },
      { label: 'Trailside store', url: 'https://trailside.example/p/350?ref=trailbench', isAffiliate: true },
    ];
    // Validation (422) and nothing written: http:, javascript:, data:, credentials in the URL, too many, extra keys.
    for (const bad of [
      [{ ...links[0], url: 'http://shop.example/x' }],
      [{ ...links[0], url: 'javascript:alert(1)' }],
      [{ ...links[0], url: 'data:text/html,<script>alert(1)</script>' }],
      [{ ...links[0], url: 'https://user:pw@shop.example/' }],
      [{ ...links[0], label: '  ' }],
      [{ ...links[0], extra: 1 }],
      Array.from({ length: 7 }, () => links[0]),
    ]) {
      expect(code(() => saveBuyLinks(db, author, id, { links: bad }))).toBe('invalid');
    }
    expect(db.select().from(reviewBuyLinks).all()).toHaveLength(0);
    expect(code(() => saveBuyLinks(db, other, id, { links }))).toBe('not_found'); // another reviewer cannot see the draft
    expect(code(() => saveBuyLinks(db, editor, id, { links }))).toBe('forbidden');
    expect(saveBuyLinks(db, author, id, { links })).toEqual(links);
    publish(id);
    expect(code(() => saveBuyLinks(db, author, id, { links: [] }))).toBe('conflict'); // published links never change
    expect(getReviewPage(db, slug, null).buyLinks).toEqual(links);
    transitionReview(db, author, id, 'start-correction');
    expect(getReviewPage(db, slug, author, 2).buyLinks).toEqual(links);
    saveBuyLinks(db, author, id, { links: [links[1]] });
    expect(getReviewPage(db, slug, null).buyLinks).toEqual(links); // the public revision keeps its links
  });

  it('rel marks every link sponsored and affiliate links nofollow too', () => {
    expect(buyLinkRel({ isAffiliate: false })).toBe('sponsored noopener');
    expect(buyLinkRel({ isAffiliate: true })).toBe('sponsored nofollow noopener');
  });
});

describe('demo where-to-buy links', () => {
  it('are valid, on reserved example domains only (RFC 2606), shown on the demo review and seeded once', async () => {
    const { DEMO_BUY_LINKS } = await import('@/db/seed/buy-links');
    const { seedDemo } = await import('@/db/seed');
    const { buyLinksSchema } = await import('@/lib/reviews/buy-links');
    for (const links of Object.values(DEMO_BUY_LINKS)) {
      expect(buyLinksSchema.safeParse({ links }).success).toBe(true);
      for (const l of links) expect(new URL(l.url).hostname).toMatch(/(^|\.)example(\.com)?$/);
    }
    const fresh = createTestDb().db;
    const first = await seedDemo(fresh);
    expect(first.inserted.reviewBuyLinks).toBe(Object.values(DEMO_BUY_LINKS).reduce((n, l) => n + l.length, 0));
    expect((await seedDemo(fresh)).inserted.reviewBuyLinks).toBe(0);
    const page = getReviewPage(fresh, 'glowmere-hearthglow-400-lantern-review', null);
    expect(page.buyLinks.map((l) => l.isAffiliate)).toEqual([false, true]);
  });
});

import { beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import fc from 'fast-check';
import { eq } from 'drizzle-orm';
import { createTestDb } from '@/db/test-db';
import type { Db } from '@/db/connection';
import { gearItems, type Role } from '@/db/schema';
import { createUser } from '@/db/users';
import { createReviewDraft, transitionReview, updateReviewDraft, type Actor } from '@/db/reviews';
import { searchPublic } from '@/db/search';
import { queryTerms, toMatchQuery } from '@/lib/search/query';
import { HIT_CLOSE, HIT_OPEN, snippetParts } from '@/lib/search/snippet';

let db: Db;
let author: Actor;
let editor: Actor;
let itemId: string;

function user(name: string, role: Role): Actor {
  return { id: createUser(db, { email: `${name}@example.test`, name, passwordHash: null, role }).id, role };
}

const draft = (body: string, extra: Record<string, unknown> = {}) => ({
  title: 'Quillwort lantern in the mess tent',
  summary: 'A calm light for long evenings.',
  verdict: 'Worth carrying.',
  body,
  disclosure: 'bought-retail',
  disclosureNote: '',
  correctionNote: '',
  itemIds: [itemId],
  ...extra,
});

function publish(reviewId: string): void {
  transitionReview(db, author, reviewId, 'submit');
  transitionReview(db, editor, reviewId, 'approve');
  transitionReview(db, editor, reviewId, 'publish');
}

const slugs = (q: string) => searchPublic(db, q).hits.map((h) => `${h.kind}:${h.slug}`);

beforeAll(() => {
  db = createTestDb().db;
  author = user('author', 'reviewer');
  editor = user('editor', 'editor');
  itemId = randomUUID();
  db.insert(gearItems).values({ id: itemId, slug: 'tarnlight', ownerId: author.id, name: 'Tarnlight 300', maker: 'Northcairn', category: 'light', notes: 'Folds flat.', status: 'approved', approvedAt: new Date() }).run();
});

describe('query builder (lib/search/query.ts)', () => {
  it('keeps only words, quotes each and makes the last a prefix', () => {
    expect(toMatchQuery('lantern run')).toBe('"lantern" "run"*');
    expect(toMatchQuery('  Lant ')).toBe('"lant"*');
    expect(toMatchQuery('"')).toBeNull();
    expect(toMatchQuery('AND OR (')).toBe('"and" "or"*');
    expect(toMatchQuery('NEAR(a b, 2)')).toBe('"near" "a" "b" "2"*');
    expect(toMatchQuery('title:foo^ -bar')).toBe('"title" "foo" "bar"*');
    expect(toMatchQuery(undefined)).toBeNull();
    expect(toMatchQuery(['lantern'])).toBeNull();
  });

  it('caps the number of terms and the length of a term', () => {
    expect(queryTerms('a b c d e f g h i j k')).toHaveLength(8);
    expect(queryTerms('x'.repeat(100))[0]).toHaveLength(40);
  });

  it('never produces anything but quoted letters and digits (property)', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 300 }), (s) => {
        const m = toMatchQuery(s);
        if (m !== null) expect(m).toMatch(/^("[\p{L}\p{N}]+"\*? ?)+$/u);
      }),
      { numRuns: 300 },
    );
  });
});

describe('snippet parts (lib/search/snippet.ts)', () => {
  it('turns markers into hits and drops Markdown punctuation', () => {
    expect(snippetParts(`**Runtime** on ${HIT_OPEN}high${HIT_CLOSE}: see [the test](/field-tests/1)`)).toEqual([
      { text: 'Runtime on ', hit: false },
      { text: 'high', hit: true },
      { text: ': see the test', hit: false },
    ]);
  });

  it('leaves HTML in the text as text (the page renders text nodes)', () => {
    expect(snippetParts(`<img src=x onerror=alert(1)> ${HIT_OPEN}x${HIT_CLOSE}`)[0]).toEqual({ text: '<img src=x onerror=alert(1)> ', hit: false });
  });
});

describe('searchPublic', () => {
  it('answers hostile queries with no error (FTS5 syntax never reaches MATCH raw)', () => {
    // Vectors aimed at FTS5 query syntax (SQLite FTS5 docs §3 "Full-text Query Syntax"): quotes, operators, NEAR, column filters, ^, *.
    for (const q of ['"', '""', 'AND OR (', 'NEAR(', 'NEAR(a b, 5)', ')', '*', 'title:x', '^lantern', '-', "'; DROP TABLE reviews; --", '\u0000', 'a'.repeat(5000), '( ( (']) {
      expect(() => searchPublic(db, q)).not.toThrow();
    }
    expect(searchPublic(db, '"').match).toBeNull();
    expect(searchPublic(db, '"').hits).toEqual([]);
  });

  it('finds a public gear item by maker, name (stemmed, prefix) and notes, never an unapproved one', () => {
    const hidden = randomUUID();
    db.insert(gearItems).values({ id: hidden, slug: 'hidden-tarnlight', ownerId: author.id, name: 'Tarnlight prototype', maker: 'Northcairn', category: 'light', status: 'draft' }).run();
    expect(slugs('tarnlight')).toEqual(['gear:tarnlight']);
    expect(slugs('tarnl')).toEqual(['gear:tarnlight']);
    expect(slugs('fold')).toContain('gear:tarnlight'); // porter: "folds" → "fold"
    const hit = searchPublic(db, 'tarnlight').hits[0]!;
    expect(hit.title).toBe(`Northcairn ${HIT_OPEN}Tarnlight${HIT_CLOSE} 300`);
    // Approving shows it; taking the approval away (as a retraction would) hides it again.
    db.update(gearItems).set({ approvedAt: new Date(), status: 'approved' }).where(eq(gearItems.id, hidden)).run();
    expect(slugs('prototype')).toEqual(['gear:hidden-tarnlight']);
    db.update(gearItems).set({ approvedAt: null, status: 'draft' }).where(eq(gearItems.id, hidden)).run();
    expect(slugs('prototype')).toEqual([]);
    db.delete(gearItems).where(eq(gearItems.id, hidden)).run();
  });

  it('follows a review through publish, correction and retraction', () => {
    const { id, slug } = createReviewDraft(db, author, { title: 'Quillwort lantern in the mess tent', itemIds: [itemId] });
    updateReviewDraft(db, author, id, draft('It burned for five hours on the porcupine setting.'));
    expect(slugs('porcupine')).toEqual([]); // a draft is not searchable
    transitionReview(db, author, id, 'submit');
    transitionReview(db, editor, id, 'approve');
    expect(slugs('porcupine')).toEqual([]); // approved is not yet public
    transitionReview(db, editor, id, 'publish');
    expect(slugs('porcupine')).toEqual([`review:${slug}`]);
    expect(slugs('porcu')).toEqual([`review:${slug}`]);
    expect(slugs('quillworts')).toEqual([`review:${slug}`]); // porter stem of the title word
    const snippet = searchPublic(db, 'porcupine').hits[0]!.snippet;
    expect(snippet).toContain(`${HIT_OPEN}porcupine${HIT_CLOSE}`);

    // A correction in progress changes nothing public; once published its text replaces the old one.
    transitionReview(db, author, id, 'start-correction');
    updateReviewDraft(db, author, id, draft('It burned for five hours on the hedgehog setting.', { correctionNote: 'Named the setting right.' }));
    expect(slugs('hedgehog')).toEqual([]);
    expect(slugs('porcupine')).toEqual([`review:${slug}`]);
    publish(id);
    expect(slugs('hedgehog')).toEqual([`review:${slug}`]);
    expect(slugs('porcupine')).toEqual([]);

    transitionReview(db, editor, id, 'retract', 'The runtime figure was from the wrong trial.');
    expect(slugs('hedgehog')).toEqual([]);
    expect(slugs('quillwort')).toEqual([]);
  });

  it('ranks a title hit above a body hit', () => {
    const a = createReviewDraft(db, author, { title: 'Marshlight notes', itemIds: [itemId] });
    updateReviewDraft(db, author, a.id, draft('Plain words.', { title: 'Marshlight notes' }));
    publish(a.id);
    const b = createReviewDraft(db, author, { title: 'Another evening', itemIds: [itemId] });
    updateReviewDraft(db, author, b.id, draft('We compared it with a marshlight once, briefly, among many other lights and lamps and torches.', { title: 'Another evening' }));
    publish(b.id);
    expect(slugs('marshlight').slice(0, 2)).toEqual([`review:${a.slug}`, `review:${b.slug}`]);
  });
});

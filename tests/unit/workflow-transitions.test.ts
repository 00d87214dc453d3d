import { describe, expect, it } from 'vitest';
import {
  availableActions,
  canEditText,
  decide,
  STATES_OF,
  WORKFLOW_ACTIONS,
  WORKFLOW_KINDS,
  type WorkflowAction,
  type WorkflowKind,
  type WorkflowRole,
  type WorkflowState,
} from '@/lib/workflow/transitions';

/*
 * Expected values: the two transition tables of issue 6 ("Workflow", `issues show 6`), typed in
 * here by hand, row for row. Everything not listed is refused: 403 when the actor is not someone
 * the table names for that action, 409 when they are but the state is wrong (status order of
 * lib/http/errors.ts: 403 before 409 before 422).
 */
type Who = 'author' | 'editor' | 'editor-not-author';
const TABLE: [WorkflowKind, WorkflowState, WorkflowAction, WorkflowState, Who][] = [
  // Reviews
  ['review', 'draft', 'submit', 'in-review', 'author'],
  ['review', 'in-review', 'withdraw', 'draft', 'author'],
  ['review', 'in-review', 'request-changes', 'changes-requested', 'editor-not-author'],
  ['review', 'changes-requested', 'submit', 'in-review', 'author'],
  ['review', 'in-review', 'approve', 'approved', 'editor-not-author'],
  ['review', 'approved', 'request-changes', 'changes-requested', 'editor'],
  ['review', 'approved', 'publish', 'published', 'editor'],
  ['review', 'published', 'retract', 'retracted', 'editor'],
  ['review', 'published', 'start-correction', 'draft', 'author'],
  ['review', 'retracted', 'start-correction', 'draft', 'author'],
  // Gear items, field tests, long-term notes (approved means public)
  ['record', 'draft', 'submit', 'in-review', 'author'],
  ['record', 'in-review', 'withdraw', 'draft', 'author'],
  ['record', 'in-review', 'request-changes', 'changes-requested', 'editor-not-author'],
  ['record', 'changes-requested', 'submit', 'in-review', 'author'],
  ['record', 'in-review', 'approve', 'approved', 'editor-not-author'],
  ['record', 'approved', 'retract', 'retracted', 'editor'],
  ['record', 'approved', 'start-correction', 'draft', 'author'],
  ['record', 'retracted', 'start-correction', 'draft', 'author'],
];

const AUTHOR = 'user-author';
interface Profile {
  label: string;
  role: WorkflowRole;
  isAuthor: boolean;
}
const PROFILES: Profile[] = (['reader', 'reviewer', 'editor', 'admin'] as const).flatMap((role) => [
  { label: `${role} (author)`, role, isAuthor: true },
  { label: `${role} (not the author)`, role, isAuthor: false },
]);

/** Role rank from the brief: reader < reviewer < editor < admin; authors must be reviewers or above. */
function fits(who: Who, p: Profile): boolean {
  const editor = p.role === 'editor' || p.role === 'admin';
  if (who === 'author') return p.isAuthor && p.role !== 'reader';
  if (who === 'editor') return editor;
  return editor && !p.isAuthor;
}

const NEEDS_TEXT: WorkflowAction[] = ['request-changes', 'retract'];

function expected(kind: WorkflowKind, state: WorkflowState, action: WorkflowAction, p: Profile) {
  const rows = TABLE.filter((r) => r[0] === kind && r[2] === action);
  const here = rows.filter((r) => r[1] === state);
  const allowed = here.find((r) => fits(r[4], p));
  if (allowed) return { ok: true as const, to: allowed[3] };
  if (rows.length === 0) return { ok: false as const, code: 'conflict' as const }; // publish on a record: no such row
  if (here.length > 0) return { ok: false as const, code: 'forbidden' as const };
  if (!rows.some((r) => fits(r[4], p))) return { ok: false as const, code: 'forbidden' as const };
  return { ok: false as const, code: 'conflict' as const };
}

describe('decide: every kind × state × action × role, allowed and refused', () => {
  const cases = WORKFLOW_KINDS.flatMap((kind) =>
    STATES_OF[kind].flatMap((state) => WORKFLOW_ACTIONS.flatMap((action) => PROFILES.map((p) => ({ kind, state, action, p })))),
  );

  it('covers the whole matrix', () => {
    // 6 review states + 5 record states, 7 actions, 8 actor profiles.
    expect(cases).toHaveLength((6 + 5) * 7 * 8);
    // Every row of the tables is reached by at least one profile.
    for (const [kind, state, action] of TABLE) {
      expect(cases.some((c) => c.kind === kind && c.state === state && c.action === action && expected(kind, state, action, c.p).ok)).toBe(true);
    }
  });

  it.each(cases.map((c) => [c.kind, c.state, c.action, c.p.label, c] as const))('%s · %s · %s · %s', (_k, _s, _a, _l, c) => {
    const actor = { id: c.p.isAuthor ? AUTHOR : 'user-other', role: c.p.role };
    const result = decide({ kind: c.kind, state: c.state, action: c.action, actor, authorId: AUTHOR, comment: 'A comment.' });
    const want = expected(c.kind, c.state, c.action, c.p);
    if (want.ok) {
      expect(result).toMatchObject({ ok: true, from: c.state, to: want.to, newRevision: c.action === 'start-correction' });
    } else {
      expect(result).toMatchObject({ ok: false, code: want.code, status: want.code === 'forbidden' ? 403 : 409 });
      if (!result.ok) expect(result.message.length).toBeGreaterThan(10);
    }
    // Without a comment, actions that need one are refused with 422 where they would otherwise pass.
    const bare = decide({ kind: c.kind, state: c.state, action: c.action, actor, authorId: AUTHOR, comment: '   ' });
    if (want.ok && NEEDS_TEXT.includes(c.action)) expect(bare).toMatchObject({ ok: false, code: 'invalid', status: 422 });
    else expect(bare.ok).toBe(want.ok);
  });
});

describe('decide: messages and special rules', () => {
  const editorAuthor = { id: AUTHOR, role: 'editor' as const };
  it('authors never approve their own work, even as editors or admins', () => {
    for (const role of ['editor', 'admin'] as const) {
      for (const kind of WORKFLOW_KINDS) {
        const r = decide({ kind, state: 'in-review', action: 'approve', actor: { id: AUTHOR, role }, authorId: AUTHOR });
        expect(r).toMatchObject({ ok: false, code: 'forbidden' });
        if (!r.ok) expect(r.message).toMatch(/cannot approve their own/);
      }
    }
  });
  it('explains a request for changes on a public record', () => {
    const r = decide({ kind: 'record', state: 'approved', action: 'request-changes', actor: { id: 'e', role: 'editor' }, authorId: AUTHOR, comment: 'x' });
    expect(r).toMatchObject({ ok: false, code: 'conflict' });
    if (!r.ok) expect(r.message).toMatch(/public/);
  });
  it('an author-editor may send back their own approved review (the table says "editor")', () => {
    expect(decide({ kind: 'review', state: 'approved', action: 'request-changes', actor: editorAuthor, authorId: AUTHOR, comment: 'fix' }).ok).toBe(true);
  });
  it('keeps the trimmed comment', () => {
    expect(decide({ kind: 'review', state: 'published', action: 'retract', actor: { id: 'e', role: 'admin' }, authorId: AUTHOR, comment: '  Wrong figures.  ' })).toMatchObject({
      ok: true,
      comment: 'Wrong figures.',
    });
  });
  it('lists the available actions for buttons', () => {
    expect(availableActions({ kind: 'review', state: 'in-review', actor: { id: 'e', role: 'editor' }, authorId: AUTHOR })).toEqual(['request-changes', 'approve']);
    expect(availableActions({ kind: 'review', state: 'in-review', actor: { id: AUTHOR, role: 'reviewer' }, authorId: AUTHOR })).toEqual(['withdraw']);
    expect(availableActions({ kind: 'review', state: 'approved', actor: { id: 'e', role: 'editor' }, authorId: AUTHOR })).toEqual(['request-changes', 'publish']);
    expect(availableActions({ kind: 'review', state: 'draft', actor: { id: 'r', role: 'reader' }, authorId: AUTHOR })).toEqual([]);
  });
  it('text is editable only by its author while draft or returned', () => {
    const author = { id: AUTHOR, role: 'reviewer' as const };
    expect(STATES_OF.review.filter((s) => canEditText(s, author, AUTHOR))).toEqual(['draft', 'changes-requested']);
    expect(canEditText('draft', { id: 'e', role: 'admin' }, AUTHOR)).toBe(false);
    expect(canEditText('draft', { id: AUTHOR, role: 'reader' }, AUTHOR)).toBe(false);
    expect(canEditText('draft', null, AUTHOR)).toBe(false);
  });
});

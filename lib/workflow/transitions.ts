/**
 * The editorial workflow, pure: one module for both tables of issue 6.
 *
 * - `review`: draft → in review → changes requested → approved → published → retracted.
 * - `record` (gear items, field tests, long-term notes): the same up to approved, where approved
 *   means public; approved → retract → retracted; no request-changes on a public revision.
 *
 * `decide()` answers, for one attempt, either the next state or a typed refusal. Checks follow the
 * app's status order (lib/http/errors.ts): 403 `forbidden` when the actor may never take this action
 * on this work (wrong role, not the author, an author approving their own work), then 409 `conflict`
 * when the work's state does not allow it, then 422 `invalid` when a required comment is missing.
 * Whether the caller may *see* the work (404) is the data layer's question, asked before this one.
 *
 * No framework, database or clock imports.
 */

export const WORKFLOW_KINDS = ['review', 'record'] as const;
export type WorkflowKind = (typeof WORKFLOW_KINDS)[number];

export const WORKFLOW_STATES = ['draft', 'in-review', 'changes-requested', 'approved', 'published', 'retracted'] as const;
export type WorkflowState = (typeof WORKFLOW_STATES)[number];

export const WORKFLOW_ACTIONS = ['submit', 'withdraw', 'request-changes', 'approve', 'publish', 'retract', 'start-correction'] as const;
export type WorkflowAction = (typeof WORKFLOW_ACTIONS)[number];

export type WorkflowRole = 'reader' | 'reviewer' | 'editor' | 'admin';

/** The states a kind of work can be in. */
export const STATES_OF: Record<WorkflowKind, readonly WorkflowState[]> = {
  review: WORKFLOW_STATES,
  record: ['draft', 'in-review', 'changes-requested', 'approved', 'retracted'],
};

/** Who may take an action: the work's author (a reviewer or above), or an editor/admin (optionally never the author). */
type Who = 'author' | 'editor' | 'editor-not-author';

interface Rule {
  from: readonly WorkflowState[];
  /** `start-correction` opens a new draft revision; every other action moves the same revision. */
  to: WorkflowState;
  who: Who;
  /** A comment the action cannot go without, and what to call it in messages. */
  needs?: 'comment' | 'public-note';
}

/** Issue 6, "Workflow": the two tables, rule for rule. */
export const RULES: Record<WorkflowKind, Partial<Record<WorkflowAction, Rule[]>>> = {
  review: {
    submit: [{ from: ['draft', 'changes-requested'], to: 'in-review', who: 'author' }],
    withdraw: [{ from: ['in-review'], to: 'draft', who: 'author' }],
    'request-changes': [
      { from: ['in-review'], to: 'changes-requested', who: 'editor-not-author', needs: 'comment' },
      { from: ['approved'], to: 'changes-requested', who: 'editor', needs: 'comment' },
    ],
    approve: [{ from: ['in-review'], to: 'approved', who: 'editor-not-author' }],
    publish: [{ from: ['approved'], to: 'published', who: 'editor' }],
    retract: [{ from: ['published'], to: 'retracted', who: 'editor', needs: 'public-note' }],
    'start-correction': [{ from: ['published', 'retracted'], to: 'draft', who: 'author' }],
  },
  record: {
    submit: [{ from: ['draft', 'changes-requested'], to: 'in-review', who: 'author' }],
    withdraw: [{ from: ['in-review'], to: 'draft', who: 'author' }],
    'request-changes': [{ from: ['in-review'], to: 'changes-requested', who: 'editor-not-author', needs: 'comment' }],
    approve: [{ from: ['in-review'], to: 'approved', who: 'editor-not-author' }],
    retract: [{ from: ['approved'], to: 'retracted', who: 'editor', needs: 'public-note' }],
    'start-correction': [{ from: ['approved', 'retracted'], to: 'draft', who: 'author' }],
  },
};

/** Revisions in these states may be edited by their author; every other state is locked. */
export const EDITABLE_STATES: readonly WorkflowState[] = ['draft', 'changes-requested'];

export interface WorkflowActor {
  id: string;
  role: WorkflowRole;
}

export interface TransitionAttempt {
  kind: WorkflowKind;
  state: WorkflowState;
  action: WorkflowAction;
  actor: WorkflowActor;
  authorId: string;
  /** The editor's comment (request-changes) or the public note (retract); whitespace-only counts as none. */
  comment?: string | null;
}

export type RefusalCode = 'forbidden' | 'conflict' | 'invalid';

export const REFUSAL_STATUS: Record<RefusalCode, number> = { forbidden: 403, conflict: 409, invalid: 422 };

export type TransitionDecision =
  | { ok: true; from: WorkflowState; to: WorkflowState; action: WorkflowAction; comment: string; newRevision: boolean }
  | { ok: false; code: RefusalCode; status: number; message: string };

const RANK: Record<WorkflowRole, number> = { reader: 0, reviewer: 1, editor: 2, admin: 3 };
const isEditor = (actor: WorkflowActor) => RANK[actor.role] >= RANK.editor;

export const ACTION_LABELS: Record<WorkflowAction, string> = {
  submit: 'submit',
  withdraw: 'withdraw',
  'request-changes': 'request changes on',
  approve: 'approve',
  publish: 'publish',
  retract: 'retract',
  'start-correction': 'start a correction of',
};

export const STATE_LABELS: Record<WorkflowState, string> = {
  draft: 'draft',
  'in-review': 'in review',
  'changes-requested': 'changes requested',
  approved: 'approved',
  published: 'published',
  retracted: 'retracted',
};

function refuse(code: RefusalCode, message: string): TransitionDecision {
  return { ok: false, code, status: REFUSAL_STATUS[code], message };
}

/** May this actor ever take a rule's action on this work (whatever its state)? */
function permits(who: Who, actor: WorkflowActor, authorId: string): boolean {
  const isAuthor = actor.id === authorId;
  switch (who) {
    case 'author':
      return isAuthor && RANK[actor.role] >= RANK.reviewer;
    case 'editor':
      return isEditor(actor);
    case 'editor-not-author':
      return isEditor(actor) && !isAuthor;
  }
}

function forbiddenMessage(attempt: TransitionAttempt, rules: Rule[]): string {
  const { actor, authorId, action } = attempt;
  const isAuthor = actor.id === authorId;
  const whoCouldAct = new Set(rules.map((r) => r.who));
  if (isAuthor && isEditor(actor) && whoCouldAct.has('editor-not-author') && !whoCouldAct.has('editor')) {
    return action === 'approve'
      ? 'Authors cannot approve their own work, even as editors: another editor must approve it.'
      : 'Authors cannot review their own work, even as editors: another editor must do this.';
  }
  if (whoCouldAct.has('author')) {
    return isAuthor ? `Only a reviewer may ${ACTION_LABELS[action]} their work.` : `Only the author may ${ACTION_LABELS[action]} this.`;
  }
  return `Only an editor may ${ACTION_LABELS[action]} this.`;
}

function conflictMessage(attempt: TransitionAttempt, rules: Rule[]): string {
  const { kind, state, action } = attempt;
  const what = kind === 'review' ? 'review' : 'record';
  const froms = [...new Set(rules.flatMap((r) => r.from))].map((s) => STATE_LABELS[s]);
  const allowed = froms.length === 1 ? froms[0] : `${froms.slice(0, -1).join(', ')} or ${froms.at(-1)}`;
  if (action === 'request-changes' && kind === 'record' && state === 'approved') {
    return 'This record is public: changes cannot be requested on a public revision. Retract it, or ask the author to start a correction.';
  }
  if (action === 'withdraw' && state !== 'in-review' && state !== 'draft') {
    return `This ${what} is ${STATE_LABELS[state]}: it can be withdrawn only while in review, before an editor acts.`;
  }
  return `This ${what} is ${STATE_LABELS[state]}: only a ${what} that is ${allowed} can be ${pastTense(action)}.`;
}

function pastTense(action: WorkflowAction): string {
  const past: Record<WorkflowAction, string> = {
    submit: 'submitted',
    withdraw: 'withdrawn',
    'request-changes': 'sent back with changes requested',
    approve: 'approved',
    publish: 'published',
    retract: 'retracted',
    'start-correction': 'corrected',
  };
  return past[action];
}

/** The next state for one attempt, or why not (403 forbidden → 409 conflict → 422 invalid). */
export function decide(attempt: TransitionAttempt): TransitionDecision {
  const { kind, state, action, actor, authorId } = attempt;
  if (!STATES_OF[kind].includes(state)) return refuse('conflict', `A ${kind} cannot be in the state "${state}".`);
  const rules = RULES[kind][action];
  if (!rules) {
    // Only `publish` on a record: approval already made it public.
    return refuse('conflict', 'Gear items, field tests and long-term notes are public once approved: there is nothing to publish.');
  }
  const permitted = rules.filter((rule) => permits(rule.who, actor, authorId));
  if (permitted.length === 0) return refuse('forbidden', forbiddenMessage(attempt, rules));
  const rule = permitted.find((r) => r.from.includes(state));
  if (!rule) {
    // A rule for this state exists but not for this actor (e.g. an author-editor on their own review in review).
    const otherRule = rules.find((r) => r.from.includes(state));
    if (otherRule) return refuse('forbidden', forbiddenMessage(attempt, [otherRule]));
    return refuse('conflict', conflictMessage(attempt, rules));
  }
  const comment = (attempt.comment ?? '').trim();
  if (rule.needs === 'comment' && !comment) {
    return refuse('invalid', 'Write a comment saying what should change: the author sees it with the returned draft.');
  }
  if (rule.needs === 'public-note' && !comment) {
    return refuse('invalid', 'Write a public note saying why this is retracted: readers see it in place of the text.');
  }
  return { ok: true, from: state, to: rule.to, action, comment, newRevision: action === 'start-correction' };
}

/** Actions the actor could take now (for buttons); each would pass `decide` given any needed comment. */
export function availableActions(attempt: Omit<TransitionAttempt, 'action' | 'comment'>): WorkflowAction[] {
  return WORKFLOW_ACTIONS.filter((action) => decide({ ...attempt, action, comment: 'x' }).ok);
}

/** May the actor edit the revision's text in this state? Only its author (a reviewer or above), and only while draft or returned. */
export function canEditText(state: WorkflowState, actor: WorkflowActor | null | undefined, authorId: string): boolean {
  return !!actor && actor.id === authorId && RANK[actor.role] >= RANK.reviewer && EDITABLE_STATES.includes(state);
}

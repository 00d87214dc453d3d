import type { ApiCaller } from './api-caller';

/** What GET /api/v1/me answers: enough for a script to check its token, nothing more (no e-mail, no ids of others). */
export function callerView(caller: ApiCaller) {
  return { caller: { id: caller.id, name: caller.name, role: caller.role, via: caller.via, scope: caller.scope } };
}

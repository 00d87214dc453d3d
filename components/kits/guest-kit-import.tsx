'use client';

import { useRouter } from 'next/navigation';
import { useEffect, useRef, useState } from 'react';
import { GUEST_KIT_KEY, readGuestKit } from './kit-editor';

/** After sign-in: saves the kit built in this browser as a guest to the account, then opens it. */
export function GuestKitImport() {
  const router = useRouter();
  const started = useRef(false);
  const [state, setState] = useState<'idle' | 'saving' | 'failed'>('idle');
  useEffect(() => {
    if (started.current) return;
    started.current = true;
    const kit = readGuestKit();
    if (!kit || kit.entries.length === 0) return;
    void (async () => {
      await Promise.resolve();
      setState('saving');
      const response = await fetch('/api/v1/kits', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(kit) });
      if (!response.ok) return setState('failed');
      const body = (await response.json()) as { kit: { id: string } };
      window.localStorage.removeItem(GUEST_KIT_KEY);
      router.push(`/kits/${body.kit.id}?from=browser`);
    })();
  }, [router]);
  if (state === 'idle') return null;
  return (
    <p role="status" className="rounded-md bg-lichen-tint px-3 py-2 text-sm" data-testid="guest-import">
      {state === 'saving' ? 'Saving the kit you built before signing in…' : 'The kit you built before signing in could not be saved; it is still kept in this browser.'}
    </p>
  );
}

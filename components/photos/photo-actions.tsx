'use client';

import { useRouter } from 'next/navigation';
import { useId, useState } from 'react';
import { Button } from '@/components/ui/form';

/** Alt-text editing and deletion for one photo (owner or editor); calls the JSON photo API. */
export function PhotoActions({ slug, photoId, altText }: { slug: string; photoId: string; altText: string }) {
  const router = useRouter();
  const id = useId();
  const [alt, setAlt] = useState(altText);
  const [message, setMessage] = useState<{ tone: 'ok' | 'error'; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const url = `/api/v1/gear/${encodeURIComponent(slug)}/photos/${encodeURIComponent(photoId)}`;

  async function send(init: RequestInit, done: string) {
    setBusy(true);
    setMessage(null);
    try {
      const response = await fetch(url, init);
      if (!response.ok) {
        const body = (await response.json().catch(() => null)) as { error?: { message?: string; fields?: Record<string, string[]> } } | null;
        setMessage({ tone: 'error', text: body?.error?.fields?.alt?.[0] ?? body?.error?.message ?? `Failed (status ${response.status}).` });
        return;
      }
      setMessage({ tone: 'ok', text: done });
      router.refresh();
    } catch {
      setMessage({ tone: 'error', text: 'The connection was lost. Try again.' });
    } finally {
      setBusy(false);
    }
  }

  return (
    <form
      className="space-y-2"
      onSubmit={(event) => {
        event.preventDefault();
        void send({ method: 'PATCH', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ alt }) }, 'Alt text saved.');
      }}
    >
      <label htmlFor={`${id}-alt`} className="block text-sm font-semibold">
        Alt text
      </label>
      <input
        id={`${id}-alt`}
        required
        maxLength={300}
        value={alt}
        onChange={(event) => setAlt(event.target.value)}
        className="block w-full rounded-md border border-rule bg-paper px-3 py-2 text-sm text-ink"
      />
      <div className="flex gap-2">
        <Button type="submit" variant="quiet" disabled={busy}>
          Save alt text
        </Button>
        <Button
          type="button"
          variant="danger"
          disabled={busy}
          onClick={() => {
            if (window.confirm('Delete this photo? Its files are removed too.')) void send({ method: 'DELETE' }, 'Photo deleted.');
          }}
        >
          Delete photo
        </Button>
      </div>
      {message ? (
        <p role={message.tone === 'error' ? 'alert' : 'status'} className={message.tone === 'error' ? 'text-sm text-danger' : 'text-sm text-lichen'}>
          {message.text}
        </p>
      ) : null}
    </form>
  );
}

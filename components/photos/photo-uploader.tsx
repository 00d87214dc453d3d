'use client';

import { useRouter } from 'next/navigation';
import { useCallback, useEffect, useId, useRef, useState } from 'react';
import { useDropzone, type FileRejection } from 'react-dropzone';
import { Button } from '@/components/ui/form';
import { uploadPhotoXhr } from './upload-request';

/*
 * Photo uploader for a gear item: drop files or choose them with a real button, describe each one
 * (alt text is required), then upload. Each file goes up on its own XMLHttpRequest so its <progress>
 * bar shows real upload progress; errors are shown per file in words. The server checks everything again.
 */

const MAX_FILE_BYTES = 15 * 1024 * 1024;
const ALT_TEXT_MAX = 300;
const ACCEPT = { 'image/jpeg': ['.jpg', '.jpeg'], 'image/png': ['.png'], 'image/webp': ['.webp'], 'image/avif': ['.avif'] };

type Status = 'ready' | 'uploading' | 'done' | 'error';

interface Entry {
  key: string;
  file: File;
  preview: string;
  alt: string;
  status: Status;
  progress: number;
  message?: string;
}

export interface PhotoUploaderProps {
  /** Slug of the gear item the photos belong to. */
  slug: string;
  /** How many photos the item has now (the server enforces the limit as well). */
  photoCount: number;
  /** Per-item limit; 10 by default, as on the server. */
  maxPhotos?: number;
}

function sizeInWords(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${(bytes / (1024 * 1024)).toFixed(1)} MB` : `${Math.max(1, Math.round(bytes / 1024))} KB`;
}

function rejectionInWords(rejection: FileRejection): string {
  const name = rejection.file.name;
  const code = rejection.errors[0]?.code;
  if (code === 'file-too-large') return `${name} is ${sizeInWords(rejection.file.size)}; the limit is 15 MB per photo.`;
  if (code === 'file-invalid-type') {
    return /\.(heic|heif)$/i.test(name)
      ? `${name} is a HEIC photo, which we do not accept. Export it as JPEG and try again.`
      : `${name} is not a JPEG, PNG, WebP or AVIF image.`;
  }
  return `${name} could not be added: ${rejection.errors[0]?.message ?? 'unknown reason'}.`;
}

export function PhotoUploader({ slug, photoCount, maxPhotos = 10 }: PhotoUploaderProps) {
  const router = useRouter();
  const baseId = useId();
  const [entries, setEntries] = useState<Entry[]>([]);
  const [notices, setNotices] = useState<string[]>([]);
  const [busy, setBusy] = useState(false);
  const counter = useRef(0);
  const entriesRef = useRef(entries);
  useEffect(() => {
    entriesRef.current = entries;
  }, [entries]);

  const pending = entries.filter((e) => e.status !== 'done');
  // photoCount comes from the server and is refreshed after each successful batch (router.refresh()).
  const room = Math.max(0, maxPhotos - photoCount);

  useEffect(() => () => entriesRef.current.forEach((e) => URL.revokeObjectURL(e.preview)), []);

  const onDrop = useCallback(
    (accepted: File[], rejected: FileRejection[]) => {
      const words = rejected.map(rejectionInWords);
      const free = room - pending.length;
      const taken = accepted.slice(0, Math.max(0, free));
      for (const file of accepted.slice(taken.length)) words.push(`${file.name} was not added: an item can have at most ${maxPhotos} photos.`);
      setNotices(words);
      setEntries((current) => [
        ...current.filter((e) => {
          if (e.status !== 'done') return true;
          URL.revokeObjectURL(e.preview);
          return false;
        }),
        ...taken.map((file) => {
          counter.current += 1;
          return { key: `f${counter.current}`, file, preview: URL.createObjectURL(file), alt: '', status: 'ready' as const, progress: 0 };
        }),
      ]);
    },
    [room, pending.length, maxPhotos],
  );

  const { getRootProps, getInputProps, isDragActive, open } = useDropzone({
    accept: ACCEPT,
    maxSize: MAX_FILE_BYTES,
    multiple: true,
    noClick: true,
    noKeyboard: true,
    disabled: busy,
    onDrop,
  });

  const update = (key: string, patch: Partial<Entry>) => setEntries((current) => current.map((e) => (e.key === key ? { ...e, ...patch } : e)));

  const remove = (key: string) =>
    setEntries((current) => {
      const entry = current.find((e) => e.key === key);
      if (entry) URL.revokeObjectURL(entry.preview);
      return current.filter((e) => e.key !== key);
    });

  async function uploadAll() {
    const queue = entriesRef.current.filter((e) => e.status === 'ready' || e.status === 'error');
    let missing = false;
    for (const entry of queue) {
      if (!entry.alt.trim()) {
        missing = true;
        update(entry.key, { status: 'error', message: 'Describe this photo before uploading it (alt text is required).' });
      }
    }
    if (missing || queue.length === 0) return;
    setBusy(true);
    let anyDone = false;
    for (const entry of queue) {
      update(entry.key, { status: 'uploading', progress: 0, message: undefined });
      const outcome = await uploadPhotoXhr(slug, entry.file, entry.alt.trim(), (fraction) => update(entry.key, { progress: fraction }));
      if (outcome.ok) {
        anyDone = true;
        update(entry.key, { status: 'done', progress: 1, message: 'Uploaded.' });
      } else {
        update(entry.key, { status: 'error', message: outcome.message });
      }
    }
    setBusy(false);
    if (anyDone) router.refresh();
  }

  const canAdd = room - pending.length > 0;

  return (
    <section aria-labelledby={`${baseId}-title`} className="space-y-4 rounded-lg border border-rule bg-card p-4" data-testid="photo-uploader">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id={`${baseId}-title`} className="text-lg font-semibold">
          Add photos
        </h2>
        <p className="text-sm text-slate">
          {photoCount} of {maxPhotos} photos · JPEG, PNG, WebP or AVIF · up to 15 MB each · location and camera data are removed
        </p>
      </div>

      <div
        {...getRootProps({
          className: `flex flex-col items-center gap-3 rounded-md border-2 border-dashed p-6 text-center ${isDragActive ? 'border-lichen bg-lichen-tint' : 'border-rule'}`,
        })}
      >
        <input {...getInputProps({ 'aria-label': 'Photo files' })} data-testid="photo-file-input" />
        <p className="text-sm">{isDragActive ? 'Drop the photos here.' : 'Drag photos here, or'}</p>
        <Button type="button" variant="quiet" onClick={open} disabled={busy || !canAdd}>
          Choose photos…
        </Button>
        {!canAdd ? <p className="text-sm text-slate">This item has room for no more photos.</p> : null}
      </div>

      {notices.length ? (
        <ul role="alert" className="space-y-1 rounded-md bg-danger-tint px-3 py-2 text-sm text-danger">
          {notices.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      ) : null}

      {entries.length ? (
        <ul className="space-y-3">
          {entries.map((entry, index) => {
            const altId = `${baseId}-alt-${entry.key}`;
            const msgId = `${baseId}-msg-${entry.key}`;
            return (
              <li key={entry.key} className="flex gap-3 rounded-md border border-rule bg-paper p-3" data-testid="photo-upload-row">
                {/* eslint-disable-next-line @next/next/no-img-element -- a local blob preview, not a served image */}
                <img src={entry.preview} alt="" className="h-20 w-20 flex-none rounded object-cover" />
                <div className="min-w-0 flex-1 space-y-2">
                  <p className="truncate text-sm font-semibold">
                    {entry.file.name} <span className="font-normal text-slate">({sizeInWords(entry.file.size)})</span>
                  </p>
                  <label htmlFor={altId} className="block text-sm">
                    Describe photo {index + 1} for people who cannot see it (required)
                  </label>
                  <input
                    id={altId}
                    type="text"
                    required
                    maxLength={ALT_TEXT_MAX}
                    value={entry.alt}
                    disabled={entry.status === 'uploading' || entry.status === 'done'}
                    aria-invalid={entry.status === 'error' && !entry.alt.trim() ? true : undefined}
                    aria-describedby={entry.message ? msgId : undefined}
                    onChange={(event) => update(entry.key, { alt: event.target.value, ...(entry.status === 'error' ? { status: 'ready', message: undefined } : {}) })}
                    placeholder="e.g. Lantern hanging from a tent ridge line, lit at dusk"
                    className="block w-full rounded-md border border-rule bg-paper px-3 py-2 text-ink"
                  />
                  {entry.status === 'uploading' || entry.status === 'done' ? (
                    <progress className="w-full" max={100} value={Math.round(entry.progress * 100)} aria-label={`Upload progress of ${entry.file.name}`}>
                      {Math.round(entry.progress * 100)} %
                    </progress>
                  ) : null}
                  {entry.message ? (
                    <p id={msgId} role={entry.status === 'error' ? 'alert' : 'status'} className={entry.status === 'error' ? 'text-sm text-danger' : 'text-sm text-lichen'}>
                      {entry.message}
                    </p>
                  ) : null}
                </div>
                {entry.status === 'ready' || entry.status === 'error' ? (
                  <Button type="button" variant="quiet" className="self-start" onClick={() => remove(entry.key)} aria-label={`Remove ${entry.file.name} from the list`}>
                    Remove
                  </Button>
                ) : null}
              </li>
            );
          })}
        </ul>
      ) : null}

      {pending.length ? (
        <Button type="button" onClick={uploadAll} disabled={busy}>
          {busy ? 'Uploading…' : `Upload ${pending.length} photo${pending.length === 1 ? '' : 's'}`}
        </Button>
      ) : null}
    </section>
  );
}

'use client';

/**
 * The reader's side-by-side selection in localStorage, shared by every "Add to side-by-side" button,
 * the tray and the side-by-side page (which also keeps it in its URL). Other tabs see changes through
 * the `storage` event; this tab through a custom event.
 */
import { useCallback, useSyncExternalStore } from 'react';
import { addToSelection, parseSelection, removeFromSelection, type AddResult } from '@/lib/side-by-side/selection';

const STORAGE_KEY = 'trailbench:side-by-side';
const CHANGE_EVENT = 'trailbench:side-by-side-change';
const EMPTY: string[] = [];

let cachedRaw: string | null = null;
let cachedSlugs: string[] = EMPTY;

function read(): string[] {
  let raw: string | null = null;
  try {
    raw = window.localStorage.getItem(STORAGE_KEY);
  } catch {
    return EMPTY; // storage blocked: the URL still carries the selection
  }
  if (raw === cachedRaw) return cachedSlugs;
  cachedRaw = raw;
  try {
    cachedSlugs = raw ? parseSelection(JSON.parse(raw) as unknown[]) : EMPTY;
  } catch {
    cachedSlugs = EMPTY;
  }
  return cachedSlugs;
}

export function writeSelection(slugs: readonly string[]): void {
  try {
    window.localStorage.setItem(STORAGE_KEY, JSON.stringify(slugs));
  } catch {
    // storage blocked or full: nothing to keep
  }
  window.dispatchEvent(new Event(CHANGE_EVENT));
}

function subscribe(onChange: () => void): () => void {
  const onStorage = (event: StorageEvent) => {
    if (event.key === STORAGE_KEY) onChange();
  };
  window.addEventListener('storage', onStorage);
  window.addEventListener(CHANGE_EVENT, onChange);
  return () => {
    window.removeEventListener('storage', onStorage);
    window.removeEventListener(CHANGE_EVENT, onChange);
  };
}

export function useStoredSelection() {
  const slugs = useSyncExternalStore(subscribe, read, () => EMPTY);
  const add = useCallback((slug: string): AddResult => {
    const result = addToSelection(read(), slug);
    if (result.ok) writeSelection(result.slugs);
    return result;
  }, []);
  const remove = useCallback((slug: string) => writeSelection(removeFromSelection(read(), slug)), []);
  return { slugs, add, remove };
}

'use client';

import { useDeferredValue, useMemo } from 'react';
import { renderMarkdownSync } from '@/lib/markdown/render';
import { splitAtSpecTables } from '@/lib/reviews/split-html';
import styles from '@/components/content-page.module.css';

/**
 * Live preview through the same pipeline the published page uses (lib/markdown/render.ts, sanitizing
 * last), run in the browser. Spec tables show as a labelled box here; the published page fills them
 * from the catalog.
 */
export function MarkdownPreview({ source, itemNames }: { source: string; itemNames: Record<string, string> }) {
  const deferred = useDeferredValue(source);
  const parts = useMemo(() => splitAtSpecTables(renderMarkdownSync(deferred)), [deferred]);
  return (
    <div className={`prose-content ${styles.body}`} data-testid="preview">
      {parts.map((part, index) =>
        part.type === 'html' ? (
          // Sanitized by renderMarkdownSync (rehype-sanitize runs last).
          <div key={index} dangerouslySetInnerHTML={{ __html: part.html }} />
        ) : (
          <div key={index} className="my-4 rounded-md border border-dashed border-lichen bg-lichen-tint px-3 py-2 text-sm" data-testid="preview-spec-table">
            <strong>Spec table:</strong> {part.slugs.map((s) => itemNames[s] ?? `${s} (not in your picked items)`).join(' · ')}
            <span className="block text-xs text-slate">Filled from the catalog on the review page.</span>
          </div>
        ),
      )}
    </div>
  );
}

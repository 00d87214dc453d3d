import { getDb } from '@/db';
import { specTableItems, type Actor } from '@/db/reviews';
import { renderMarkdown } from '@/lib/markdown/render';
import { splitAtSpecTables } from '@/lib/reviews/split-html';
import styles from '@/components/content-page.module.css';
import { SpecTable } from './spec-table';

/**
 * A review's Markdown through the one sanitizing pipeline (lib/markdown/render.ts), split at the
 * spec-table placeholders, each rendered as a React table read from the database — outside the
 * sanitized HTML, never inside it.
 */
export async function ReviewBody({ source, viewer }: { source: string; viewer: Actor | null }) {
  const html = await renderMarkdown(source);
  const parts = splitAtSpecTables(html);
  return (
    <div className={`prose-content review-body ${styles.body}`} data-testid="review-body">
      {parts.map((part, index) => {
        if (part.type === 'html') {
          // Sanitized by renderMarkdown (rehype-sanitize runs last): the only HTML source allowed here.
          return <div key={index} dangerouslySetInnerHTML={{ __html: part.html }} />;
        }
        const items = specTableItems(getDb(), part.slugs, viewer);
        const shown = new Set(items.map((i) => i.slug));
        return <SpecTable key={index} items={items} missing={part.slugs.filter((s) => !shown.has(s))} />;
      })}
    </div>
  );
}

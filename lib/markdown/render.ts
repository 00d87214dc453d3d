/**
 * The one Markdown pipeline of Trailbench (reviews, previews, notes, content/ pages):
 *
 *   remark-parse → remark-gfm → remark-rehype (raw HTML dropped)
 *   → our small rehype plugins (./plugins.ts)
 *   → rehype-sanitize with ./schema.ts        ← always the last transform
 *   → rehype-stringify
 *
 * Rule (security-tests MD-03): nothing that turns author input into HTML may run after
 * rehype-sanitize. tests/unit/markdown.test.ts fails if a plugin is added after it.
 *
 * Pure and framework-free: safe to call from server components, route handlers, server
 * actions and tests. Every plugin is synchronous, so a sync variant is offered too.
 */
import rehypeSanitize from 'rehype-sanitize';
import rehypeStringify from 'rehype-stringify';
import remarkGfm from 'remark-gfm';
import remarkParse from 'remark-parse';
import remarkRehype from 'remark-rehype';
import { unified } from 'unified';
import {
  rehypeCautionBlocks,
  rehypeExternalLinks,
  rehypeHeadingIds,
  rehypeInPageLinks,
  rehypeSpecTableDirective,
  rehypeUploadsOnlyImages,
} from './plugins';
import { sanitizeSchema } from './schema';

/** Longest Markdown source we render (characters); longer input is cut, not rejected. */
export const MAX_MARKDOWN_LENGTH = 200_000;

export function createMarkdownProcessor() {
  return (
    unified()
      .use(remarkParse)
      .use(remarkGfm)
      // No allowDangerousHtml: raw HTML in the source is dropped, never parsed.
      // clobberPrefix '' because rehype-sanitize adds `user-content-` itself; a second
      // prefix here would break footnote links.
      .use(remarkRehype, { clobberPrefix: '' })
      .use(rehypeSpecTableDirective)
      .use(rehypeUploadsOnlyImages)
      .use(rehypeExternalLinks)
      .use(rehypeHeadingIds)
      .use(rehypeInPageLinks)
      .use(rehypeCautionBlocks)
      // Last transform. Do not add plugins after this line (MD-03).
      .use(rehypeSanitize, sanitizeSchema)
      .use(rehypeStringify)
      .freeze()
  );
}

const processor = createMarkdownProcessor();

function prepare(source: string): string {
  const text = typeof source === 'string' ? source : '';
  return text.length > MAX_MARKDOWN_LENGTH ? text.slice(0, MAX_MARKDOWN_LENGTH) : text;
}

/** Render author Markdown to sanitized HTML, safe for dangerouslySetInnerHTML. */
export async function renderMarkdown(source: string): Promise<string> {
  const file = await processor.process(prepare(source));
  return String(file);
}

/** Synchronous twin of {@link renderMarkdown} (same processor, same output). */
export function renderMarkdownSync(source: string): string {
  return String(processor.processSync(prepare(source)));
}

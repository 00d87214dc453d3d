/**
 * Small rehype plugins of our own. They all run BEFORE rehype-sanitize, so nothing they
 * produce escapes the schema in ./schema.ts: each output they add (a heading id, a rel
 * token, a class, a data attribute) has a matching, fixed-value entry there.
 */
import type { Element, ElementContent, Parents, Root, RootContent } from 'hast';
import { CAUTION_CLASS, EXTERNAL_REL, SLUG, SPEC_TABLE_MAX_ITEMS, UPLOADS_SRC, CLOBBER_PREFIX } from './schema';

type Visitor = (node: Element, parent: Parents) => void;

/** Depth-first walk over every element; the visitor may replace the node in its parent. */
function eachElement(tree: Root, visit: Visitor): void {
  const walk = (parent: Parents) => {
    // Copy: a visitor may replace children of `parent`.
    for (const child of [...parent.children]) {
      if (child.type === 'element') {
        visit(child, parent);
        walk(child);
      }
    }
  };
  walk(tree);
}

function textOf(node: RootContent | ElementContent | Root): string {
  if (node.type === 'text') return node.value;
  if ('children' in node) return node.children.map((child) => textOf(child)).join('');
  return '';
}

function replaceChild(parent: Parents, node: Element, replacement: ElementContent[]): void {
  const index = parent.children.indexOf(node);
  if (index >= 0) (parent.children as ElementContent[]).splice(index, 1, ...replacement);
}

/**
 * `::spec-table[slug-a, slug-b]` alone in a paragraph becomes
 * `<div data-spec-table="slug-a,slug-b"></div>`, a placeholder the page replaces with a
 * React component. Anything that does not validate stays as plain text.
 */
export const SPEC_TABLE_DIRECTIVE = /^::spec-table\[([^\]\n]*)\]$/;

export function parseSpecTableDirective(text: string): string[] | null {
  const match = SPEC_TABLE_DIRECTIVE.exec(text.trim());
  if (!match) return null;
  const slugs = [
    ...new Set(
      (match[1] ?? '')
        .split(',')
        .map((slug) => slug.trim().toLowerCase())
        .filter((slug) => slug.length > 0),
    ),
  ];
  if (slugs.length === 0 || slugs.length > SPEC_TABLE_MAX_ITEMS) return null;
  if (!slugs.every((slug) => slug.length <= 120 && SLUG.test(slug))) return null;
  return slugs;
}

export function rehypeSpecTableDirective() {
  return (tree: Root) => {
    eachElement(tree, (node, parent) => {
      if (node.tagName !== 'p') return;
      if (node.children.length !== 1 || node.children[0]?.type !== 'text') return;
      const slugs = parseSpecTableDirective(node.children[0].value);
      if (!slugs) return;
      const placeholder: Element = {
        type: 'element',
        tagName: 'div',
        properties: { dataSpecTable: slugs.join(',') },
        children: [],
      };
      replaceChild(parent, node, [placeholder]);
    });
  };
}

/**
 * Images only from our own uploads. Any other image (remote, data:, javascript:, a bare
 * relative path) is replaced by its alt text, so no request ever leaves the page.
 */
export function rehypeUploadsOnlyImages() {
  return (tree: Root) => {
    eachElement(tree, (node, parent) => {
      if (node.tagName !== 'img') return;
      const src = node.properties.src;
      if (typeof src === 'string' && UPLOADS_SRC.test(src)) return;
      const alt = typeof node.properties.alt === 'string' ? node.properties.alt : '';
      replaceChild(parent, node, alt ? [{ type: 'text', value: alt }] : []);
    });
  };
}

const ABSOLUTE_HTTP = /^(?:https?:)?\/\//i;

/** Links to other hosts get rel="noopener noreferrer nofollow ugc". */
export function rehypeExternalLinks() {
  return (tree: Root) => {
    eachElement(tree, (node) => {
      if (node.tagName !== 'a') return;
      const href = node.properties.href;
      if (typeof href === 'string' && ABSOLUTE_HTTP.test(href.trim())) {
        node.properties.rel = [...EXTERNAL_REL];
      }
    });
  };
}

/** GitHub-style heading slug: lower case, letters/digits/hyphens, spaces to hyphens. */
export function slugify(text: string): string {
  return text
    .trim()
    .toLowerCase()
    .replace(/[^\p{L}\p{N}\s_-]/gu, '')
    .replace(/\s+/g, '-');
}

/**
 * Give every heading an id from its text. The sanitizer then prefixes it with
 * `user-content-`, so `# constructor` can never clobber a global.
 */
export function rehypeHeadingIds() {
  return (tree: Root) => {
    const seen = new Map<string, number>();
    eachElement(tree, (node) => {
      if (!/^h[1-6]$/.test(node.tagName) || node.properties.id !== undefined) return;
      const base = slugify(textOf(node)) || 'section';
      const count = seen.get(base) ?? 0;
      seen.set(base, count + 1);
      node.properties.id = count === 0 ? base : `${base}-${count}`;
    });
  };
}

/**
 * In-page links (`[see](#method)`, footnote references) point at the prefixed ids the
 * sanitizer will produce.
 */
export function rehypeInPageLinks() {
  return (tree: Root) => {
    eachElement(tree, (node) => {
      if (node.tagName !== 'a') return;
      const href = node.properties.href;
      if (typeof href !== 'string' || !href.startsWith('#') || href.length < 2) return;
      const target = href.slice(1);
      if (!target.startsWith(CLOBBER_PREFIX)) node.properties.href = `#${CLOBBER_PREFIX}${target}`;
    });
  };
}

/**
 * A blockquote whose first block is `**Caution**…` (bold text starting with "Caution") or
 * a heading starting with "Caution" is a safety caution: it gets class="caution".
 */
export function rehypeCautionBlocks() {
  return (tree: Root) => {
    eachElement(tree, (node) => {
      if (node.tagName !== 'blockquote') return;
      const first = node.children.find(
        (child): child is Element => child.type === 'element',
      );
      if (!first) return;
      let opener = '';
      if (/^h[1-6]$/.test(first.tagName)) {
        opener = textOf(first);
      } else if (first.tagName === 'p') {
        const lead = first.children.find((child) => !(child.type === 'text' && child.value.trim() === ''));
        if (lead?.type === 'element' && lead.tagName === 'strong') opener = textOf(lead);
      }
      if (/^caution\b/i.test(opener.trim())) node.properties.className = [CAUTION_CLASS];
    });
  };
}

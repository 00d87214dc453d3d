/**
 * The sanitize schema for every piece of Markdown Trailbench renders: reviews, notes,
 * comments and the site's own pages in content/. It starts from rehype-sanitize's
 * `defaultSchema` (GitHub-style) and only ever narrows it, with four deliberate,
 * fixed-value additions listed below.
 *
 * Raw HTML never reaches this schema (remark-rehype runs without `allowDangerousHtml`),
 * but the schema is written as if it did: it is the last line of defence.
 */
import { defaultSchema, type Options as SanitizeSchema } from 'rehype-sanitize';

/** Prefix added to every `id`, `name` and ARIA id reference (DOM-clobbering defence). */
export const CLOBBER_PREFIX = 'user-content-';

/**
 * Image sources we accept: our own uploads only, as a same-origin path with no `..`
 * segment, no backslash, no scheme and no host. An optional simple query string is
 * allowed for resized variants.
 */
export const UPLOADS_SRC = /^\/uploads\/(?!.*\.\.)[A-Za-z0-9._~%/-]+(?:\?[A-Za-z0-9=&._~%-]*)?$/;

/** A single gear-item slug: lower-case letters and digits in hyphen-separated runs. */
export const SLUG = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;

/** Most items one spec table may hold. */
export const SPEC_TABLE_MAX_ITEMS = 12;

/** Value of `data-spec-table`: 1 to 12 slugs separated by commas, nothing else. */
export const SPEC_TABLE_VALUE = /^[a-z0-9]+(?:-[a-z0-9]+)*(?:,[a-z0-9]+(?:-[a-z0-9]+)*){0,11}$/;

/** The `rel` tokens external links may carry (set by our own plugin, never by authors). */
export const EXTERNAL_REL = ['noopener', 'noreferrer', 'nofollow', 'ugc'] as const;

/** Class given to a blockquote that opens with "Caution" (styled as a safety caution). */
export const CAUTION_CLASS = 'caution';

const defaults = defaultSchema.attributes ?? {};

/** Tags of the default schema we do not want at all. */
const droppedTags = new Set([
  // <picture>/<source srcset> would let an image load from anywhere.
  'picture',
  'source',
]);

export const sanitizeSchema: SanitizeSchema = {
  ...defaultSchema,
  tagNames: (defaultSchema.tagNames ?? []).filter((tag) => !droppedTags.has(tag)),
  // Strip these elements together with their content (the default strips only script).
  strip: ['script', 'style', 'noscript', 'template', 'iframe', 'object', 'embed', 'textarea', 'title', 'xmp'],
  attributes: {
    ...defaults,
    // External links: exactly the rel tokens our plugin adds.
    a: [...(defaults.a ?? []), ['rel', ...EXTERNAL_REL]],
    // Caution blocks: one fixed class value.
    blockquote: [...(defaults.blockquote ?? []), ['className', CAUTION_CLASS]],
    // The spec-table placeholder: one data attribute, validated value. No other data-*.
    div: [...(defaults.div ?? []), ['dataSpecTable', SPEC_TABLE_VALUE]],
    // Images: our uploads only; `longDesc` (a second URL) dropped.
    img: ['ariaDescribedBy', 'ariaLabel', 'ariaLabelledBy', ['src', UPLOADS_SRC]],
    source: [],
  },
  clobberPrefix: CLOBBER_PREFIX,
  protocols: {
    cite: ['http', 'https'],
    href: ['http', 'https', 'mailto'],
    src: ['http', 'https'],
  },
};

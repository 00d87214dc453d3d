import type { Root } from 'hast';
import fc from 'fast-check';
import rehypeSanitize from 'rehype-sanitize';
import rehypeStringify from 'rehype-stringify';
import { unified } from 'unified';
import { describe, expect, it } from 'vitest';
import { createMarkdownProcessor, renderMarkdown, renderMarkdownSync } from '@/lib/markdown/render';
import { parseSpecTableDirective } from '@/lib/markdown/plugins';
import { sanitizeSchema } from '@/lib/markdown/schema';

/*
 * Payloads x01–x24: the Markdown/HTML XSS fixture of ../shared/reference/security-tests.md §3,
 * drawn from the OWASP XSS Filter Evasion Cheat Sheet (OWASP Cheat Sheet Series, licensed
 * CC BY-SA 4.0), the rehype-sanitize README example and public Markdown XSS payload lists.
 * Payloads t01– are our own additions aimed at this schema (uploads-only images, the
 * spec-table directive, the caution class, style/meta/base/form and clobbering).
 */
const FIXTURE: { id: string; src: string; expect: string }[] = [
  { id: 'x01', src: '<script>window.__xss=1</script>', expect: 'script element and its text removed' },
  { id: 'x02', src: '<img src=x onerror="window.__xss=1">', expect: 'img kept without onerror (src \'x\' is relative)' },
  { id: 'x03', src: '<svg/onload=window.__xss=1>', expect: 'svg removed' },
  { id: 'x04', src: "<IMG SRC=javascript:alert('XSS')>", expect: 'src dropped (protocol not allowed)' },
  {
    id: 'x05',
    src: '<IMG SRC=&#106;&#97;&#118;&#97;&#115;&#99;&#114;&#105;&#112;&#116;&#58;&#97;&#108;&#101;&#114;&#116;&#40;&#39;&#88;&#83;&#83;&#39;&#41;>',
    expect: 'src dropped after entity decoding',
  },
  {
    id: 'x06',
    src: '<IMG SRC=&#x6A&#x61&#x76&#x61&#x73&#x63&#x72&#x69&#x70&#x74&#x3A&#x61&#x6C&#x65&#x72&#x74&#x28&#x27&#x58&#x53&#x53&#x27&#x29>',
    expect: 'src dropped',
  },
  { id: 'x07', src: '<IMG SRC="jav&#x09;ascript:alert(\'XSS\');">', expect: 'src dropped' },
  { id: 'x08', src: '<a href=" &#14;  javascript:alert(\'XSS\');">x</a>', expect: 'href dropped' },
  { id: 'x09', src: "<BODY ONLOAD=alert('XSS')>", expect: 'body/onload removed' },
  { id: 'x10', src: '<<SCRIPT>alert("XSS");//\\<</SCRIPT>', expect: 'no script element' },
  {
    id: 'x11',
    src: "javascript:/*--></title></style></textarea></script></xmp><svg/onload='+/\"`/+/onmouseover=1/+/[*/[]/+alert(42);//'>",
    expect: 'svg removed; text inert',
  },
  {
    id: 'x12',
    src: '<iframe src="javascript:alert(1)"></iframe><iframe srcdoc="<script>alert(1)</script>"></iframe>',
    expect: 'iframes removed',
  },
  { id: 'x13', src: '<math><mi xlink:href="data:x,<script>alert(\'echo\')</script>"></mi></math>', expect: 'math/mi removed' },
  { id: 'x14', src: '<details open ontoggle="window.__xss=1"><summary>x</summary></details>', expect: 'details kept, ontoggle removed' },
  { id: 'x15', src: '<INPUT TYPE="IMAGE" SRC="javascript:alert(\'XSS\');">', expect: 'input removed (only disabled checkbox allowed)' },
  { id: 'x16', src: '<a href="data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==">x</a>', expect: 'href dropped' },
  { id: 'x17', src: '<div style="background:url(javascript:alert(1))" onmouseover="alert(1)">x</div>', expect: 'style and onmouseover removed' },
  { id: 'x18', src: '[x](javascript:alert(1))', expect: 'a without href' },
  {
    id: 'x19',
    src: '[x](JaVaScRiPt:alert(1)) [y](j    a   v   a   s   c   r   i   p   t:alert(1)) [z](javascript://%0d%0aalert(1))',
    expect: 'no javascript: href survives',
  },
  { id: 'x20', src: '[x](&#x6A&#x61&#x76&#x61&#x73&#x63&#x72&#x69&#x70&#x74&#x3A&#x61&#x6C&#x65&#x72&#x74&#x28&#x31&#x29)', expect: 'no javascript: href' },
  {
    id: 'x21',
    src: '![x](javascript:alert(1)) ![XSS\'"`onerror=alert(1)](x) ![y](https://example.com/i.png"onload="alert(1))',
    expect: 'no event attributes; unsafe src dropped',
  },
  { id: 'x22', src: '[ref]\n\n[ref]: javascript:alert(1)\n\n<javascript:alert(1)>', expect: 'reference link and autolink carry no javascript: href' },
  { id: 'x23', src: '[x](data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==) [v](vbscript:alert(1))', expect: 'no data:/vbscript: href' },
  {
    id: 'x24',
    src: '<a id="__NEXT_DATA__" name="x">c</a><form action="javascript:alert(1)"><button>go</button></form><meta http-equiv="refresh" content="0;url=javascript:alert(1)"><base href="https://evil.example/">',
    expect: 'id/name prefixed user-content-; form, button, meta, base removed',
  },
  // Our own additions.
  { id: 't01', src: '<style>body{display:none}</style>\n\n<p style="color:red">x</p>', expect: 'no style element or attribute' },
  { id: 't02', src: '![pixel](https://evil.example/p.png?c=1)', expect: 'remote image removed' },
  { id: 't03', src: '![pixel](//evil.example/p.png)', expect: 'protocol-relative image removed' },
  { id: 't04', src: '![x](data:image/svg+xml;base64,PHN2ZyBvbmxvYWQ9YWxlcnQoMSk+)', expect: 'data: image removed' },
  { id: 't05', src: '![x](/uploads/../api/admin) ![y](/uploads/a.png"onerror="alert(1))', expect: 'traversal and broken-out src removed' },
  { id: 't06', src: '[x](VBScript:msgbox(1)) [y](  jAvAsCrIpT:alert(1)) [z](java%0ascript:alert(1))', expect: 'no script scheme' },
  { id: 't07', src: '<object data="javascript:alert(1)"></object><embed src="javascript:alert(1)">', expect: 'object/embed removed' },
  { id: 't08', src: '<div data-spec-table="a,b" data-x="1" onclick="alert(1)">x</div>', expect: 'raw div dropped entirely' },
  { id: 't09', src: '::spec-table[a"onmouseover="alert(1)]\n\n::spec-table[javascript:alert(1)]', expect: 'invalid directive stays text' },
  { id: 't10', src: '# constructor\n\n# __proto__\n\n## getElementById', expect: 'heading ids prefixed' },
  { id: 't11', src: '<img name="getElementById" src="/uploads/a.png"><form id="x"><input name="attributes"></form>', expect: 'raw html dropped' },
  { id: 't12', src: '[x](https://example.com "title\\" onmouseover=\\"alert(1)")', expect: 'title stays an attribute value' },
  { id: 't13', src: '> **Caution** <img src=x onerror=alert(1)> [x](javascript:alert(1))', expect: 'caution block with nothing active' },
  { id: 't14', src: '```js" onmouseover="alert(1)\nx\n```\n\n```js&#x20;fixed&#x20;inset-0\ny\n```', expect: 'code class only language-*' },
  { id: 't15', src: '<a href="https://evil.example" rel="opener" target="_blank">x</a>', expect: 'no target, no author rel' },
  { id: 't16', src: '<link rel="stylesheet" href="https://evil.example/x.css"><noscript><p title="</noscript><img src=x onerror=alert(1)>"></noscript>', expect: 'link/noscript removed' },
];

// ---------------------------------------------------------------------------------------
// A small reader for rehype-stringify output. The serializer escapes `<` in text and `"`
// in attribute values, so every `<` in its output opens a real tag and every attribute is
// `name` or `name="value"`.

interface Tag {
  name: string;
  attributes: Map<string, string>;
}

function decodeEntities(value: string): string {
  return value
    .replace(/&#x([0-9a-f]+);?/gi, (_, hex: string) => String.fromCodePoint(parseInt(hex, 16)))
    .replace(/&#(\d+);?/g, (_, dec: string) => String.fromCodePoint(parseInt(dec, 10)))
    .replace(/&quot;/g, '"')
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&amp;/g, '&');
}

function tagsOf(html: string): Tag[] {
  const tags: Tag[] = [];
  for (const match of html.matchAll(/<([a-zA-Z][a-zA-Z0-9-]*)((?:\s+[^\s=>]+(?:="[^"]*")?)*)\s*\/?>/g)) {
    const attributes = new Map<string, string>();
    for (const attr of (match[2] ?? '').matchAll(/\s+([^\s=>]+)(?:="([^"]*)")?/g)) {
      attributes.set((attr[1] ?? '').toLowerCase(), decodeEntities(attr[2] ?? ''));
    }
    tags.push({ name: (match[1] ?? '').toLowerCase(), attributes });
  }
  // Every `<` must have been accounted for by a start or end tag.
  const opens = (html.match(/</g) ?? []).length;
  const ends = (html.match(/<\/[a-zA-Z][a-zA-Z0-9-]*>/g) ?? []).length;
  expect(tags.length + ends, `unparsed "<" in ${html}`).toBe(opens);
  return tags;
}

const FORBIDDEN_TAGS = new Set([
  'script', 'iframe', 'frame', 'frameset', 'object', 'embed', 'applet', 'form', 'button', 'textarea',
  'select', 'svg', 'math', 'meta', 'base', 'link', 'style', 'noscript', 'template', 'body', 'html',
  'head', 'title', 'xmp', 'video', 'audio', 'source', 'picture', 'track', 'portal', 'mi',
]);
const URL_ATTRIBUTES = new Set(['href', 'src', 'cite', 'action', 'formaction', 'poster', 'data', 'srcset', 'background', 'longdesc', 'xlink:href']);
const ALLOWED_SCHEMES = new Set(['http', 'https', 'mailto']);

function schemeOf(url: string): string | null {
  // Browsers strip ASCII whitespace and control characters inside a scheme.
  const compact = url.replace(/[\u0000-\u0020\u007f]/g, '');
  const match = /^([a-z][a-z0-9+.-]*):/i.exec(compact);
  return match ? (match[1] ?? '').toLowerCase() : null;
}

/** The MD-01 assertions of security-tests.md, applied to one rendered output. */
function assertInert(html: string, label: string): void {
  for (const tag of tagsOf(html)) {
    expect(FORBIDDEN_TAGS.has(tag.name), `${label}: <${tag.name}> in ${html}`).toBe(false);
    if (tag.name === 'input') {
      expect(tag.attributes.get('type'), `${label}: input type`).toBe('checkbox');
      expect(tag.attributes.has('disabled'), `${label}: input disabled`).toBe(true);
    }
    for (const [name, value] of tag.attributes) {
      expect(name.startsWith('on'), `${label}: event attribute ${name} in ${html}`).toBe(false);
      expect(name, `${label}: style attribute`).not.toBe('style');
      expect(['srcdoc', 'target', 'formaction', 'srcset'].includes(name), `${label}: ${name}`).toBe(false);
      if (URL_ATTRIBUTES.has(name)) {
        const scheme = schemeOf(value);
        expect(scheme === null || ALLOWED_SCHEMES.has(scheme), `${label}: ${name}="${value}"`).toBe(true);
      }
      if (name === 'src') {
        expect(value, `${label}: image not from uploads`).toMatch(/^\/uploads\//);
      }
      if (name === 'id' || name === 'name') {
        expect(value.startsWith('user-content-'), `${label}: ${name}="${value}" not prefixed`).toBe(true);
      }
      if (name.startsWith('data-')) {
        expect(
          ['data-spec-table', 'data-footnotes', 'data-footnote-ref', 'data-footnote-backref'].includes(name),
          `${label}: ${name}`,
        ).toBe(true);
      }
      if (name === 'class') {
        expect(value, `${label}: class`).toMatch(
          /^(?:language-\S+|caution|sr-only|footnotes|data-footnote-backref|task-list-item|contains-task-list)$/,
        );
      }
      if (name === 'rel') {
        expect(value).toBe('noopener noreferrer nofollow ugc');
      }
    }
  }
}

/** The tags of the output with attribute values blanked (escaped text inside a value is inert). */
function markupOnly(html: string): string {
  return tagsOnly(html).replace(/="[^"]*"/g, '=""');
}

/** The start tags of the output (text is escaped, so every `<` in it opens a real tag). */
function tagsOnly(html: string): string {
  return (html.match(/<[a-zA-Z][^>]*>/g) ?? []).join(' ');
}

/** Run the sanitizer alone (with our schema) on a hand-built tree and serialize it. */
function sanitizeOnly(tree: Root): string {
  const processor = unified().use(rehypeSanitize, sanitizeSchema).use(rehypeStringify);
  return processor.stringify(processor.runSync(tree));
}

describe('renderMarkdown: XSS fixture (MD-01)', () => {
  it('has at least 24 payloads with unique ids', () => {
    expect(FIXTURE.length).toBeGreaterThanOrEqual(24);
    expect(new Set(FIXTURE.map((entry) => entry.id)).size).toBe(FIXTURE.length);
  });

  it.each(FIXTURE)('$id renders inert ($expect)', async ({ id, src }) => {
    const html = await renderMarkdown(src);
    assertInert(html, id);
    // Belt and braces on the raw string: none of these can appear inside markup.
    expect(html).not.toMatch(/<script|<iframe|<svg|<object|<embed|<style|<form|<meta|<base/i);
    expect(markupOnly(html)).not.toMatch(/\son[a-z]+=/i);
    expect(tagsOnly(html)).not.toMatch(/(?:href|src)="\s*(?:javascript|vbscript|data):/i);
  });

  it('the async and sync variants agree', async () => {
    for (const { src } of FIXTURE) expect(renderMarkdownSync(src)).toBe(await renderMarkdown(src));
  });

  it('keeps the text of dangerous links but drops their href (x18, x22)', () => {
    expect(renderMarkdownSync('[x](javascript:alert(1))')).toBe('<p><a>x</a></p>');
    expect(renderMarkdownSync('<javascript:alert(1)>')).toBe('<p><a>javascript:alert(1)</a></p>');
  });

  it('leaves a code block exactly one language class (MD-04)', () => {
    const html = renderMarkdownSync('```js&#x20;fixed&#x20;inset-0\ny\n```');
    expect(html).toContain('<code class="language-js">');
  });

  // MD_PROPERTY_RUNS=20000 for a longer local hunt.
  const PROPERTY_RUNS = Number(process.env.MD_PROPERTY_RUNS ?? 150);
  // Property in the spirit of security-tests §3: random text mixed with fixture fragments
  // never yields active content.
  it('random text mixed with fixture fragments stays inert', () => {
    const fragment = fc.constantFrom(...FIXTURE.map((entry) => entry.src), '\n\n', '](', '[', '![', '<', '>', '"', '#');
    fc.assert(
      fc.property(fc.array(fc.oneof(fc.string(), fragment), { maxLength: 8 }), (parts) => {
        const html = renderMarkdownSync(parts.join(''));
        assertInert(html, 'property');
        expect(html).not.toMatch(/<script/i);
        expect(tagsOnly(html)).not.toMatch(/(?:href|src)="\s*(?:javascript|vbscript|data):/i);
        expect(markupOnly(html)).not.toMatch(/\son[a-z]+=/i);
      }),
      { numRuns: PROPERTY_RUNS },
    );
  }, 20_000 + PROPERTY_RUNS * 5);
});

describe('renderMarkdown: images', () => {
  it('removes remote images, keeping their alt text', () => {
    const html = renderMarkdownSync('![tracking pixel](https://evil.example/p.png?c=1)');
    expect(html).not.toContain('<img');
    expect(html).not.toContain('evil.example');
    expect(html).toBe('<p>tracking pixel</p>');
  });

  it('keeps images from our uploads', () => {
    const html = renderMarkdownSync('![Lantern on the bench](/uploads/2024/lantern-01.webp)');
    expect(html).toBe('<p><img src="/uploads/2024/lantern-01.webp" alt="Lantern on the bench"></p>');
  });

  it('removes relative images outside /uploads/ and traversal out of it', () => {
    for (const src of ['x.png', '/api/health', '/uploads/../api/health', '/uploads/..%2fapi', 'uploads/a.png']) {
      expect(renderMarkdownSync(`![a](${src})`), src).not.toContain('<img');
    }
  });
});

describe('renderMarkdown: links and headings', () => {
  it('gives external links rel="noopener noreferrer nofollow ugc"', () => {
    const html = renderMarkdownSync('[a](https://example.org/x) [b](http://example.net) <https://example.com>');
    expect(html.match(/rel="noopener noreferrer nofollow ugc"/g)).toHaveLength(3);
  });

  it('leaves same-site and mail links without rel', () => {
    const html = renderMarkdownSync('[gear](/gear/lantern) [mail](mailto:editor@example.org)');
    expect(html).toBe('<p><a href="/gear/lantern">gear</a> <a href="mailto:editor@example.org">mail</a></p>');
  });

  it('prefixes heading ids and keeps in-page links working', () => {
    const html = renderMarkdownSync('# Runtime to 10 %\n\n## constructor\n\n## constructor\n\nSee [above](#constructor).');
    expect(html).toContain('<h1 id="user-content-runtime-to-10-">');
    expect(html).toContain('<h2 id="user-content-constructor">');
    expect(html).toContain('<h2 id="user-content-constructor-1">');
    expect(html).toContain('<a href="#user-content-constructor">above</a>');
  });

  it('keeps footnote links pointing at their prefixed targets', () => {
    const html = renderMarkdownSync('Claimed 300 lm[^a].\n\n[^a]: From the packaging.');
    expect(html).toContain('href="#user-content-fn-a"');
    expect(html).toContain('id="user-content-fn-a"');
    expect(html).toContain('id="user-content-fnref-a"');
    expect(html).not.toContain('user-content-user-content-');
  });
});

describe('renderMarkdown: spec-table placeholder', () => {
  it('turns the directive into a data-spec-table div', () => {
    const html = renderMarkdownSync('Intro.\n\n::spec-table[northcairn-lantern-2, Glowmere-HL-300]\n\nAfter.');
    expect(html).toContain('<div data-spec-table="northcairn-lantern-2,glowmere-hl-300"></div>');
  });

  it('leaves invalid directives as plain text', () => {
    for (const bad of ['::spec-table[]', '::spec-table[a b]', '::spec-table[../etc]', '::spec-table[a_b]', `::spec-table[${Array.from({ length: 13 }, (_, i) => `s${i}`).join(',')}]`]) {
      const html = renderMarkdownSync(bad);
      expect(html, bad).not.toContain('data-spec-table');
      expect(html, bad).toMatch(/^<p>/);
    }
    expect(parseSpecTableDirective('::spec-table[ a , b , a ]')).toEqual(['a', 'b']);
  });

  // The sanitizer on its own, fed a tree our plugins could never build: it must keep the
  // one allowed attribute (with a valid value) and strip every other data attribute.
  const sanitizeTree = (properties: Record<string, string>) =>
    sanitizeOnly({ type: 'root', children: [{ type: 'element', tagName: 'div', properties, children: [] }] });

  it('survives the sanitizer with its value; other data attributes are stripped', () => {
    expect(sanitizeTree({ dataSpecTable: 'a-1,b-2', dataX: '1', dataReactRoot: '', onClick: 'alert(1)', style: 'x' })).toBe(
      '<div data-spec-table="a-1,b-2"></div>',
    );
  });

  it('drops a data-spec-table value that is not a slug list', () => {
    for (const value of ['a b', 'javascript:alert(1)', '"><script>', 'a,,b', ',a', 'a/b']) {
      expect(sanitizeTree({ dataSpecTable: value }), value).toBe('<div></div>');
    }
  });
});

describe('renderMarkdown: caution blocks', () => {
  it('marks a blockquote opening with **Caution** or a Caution heading', () => {
    expect(renderMarkdownSync('> **Caution** — never charge below 0 °C.')).toContain('<blockquote class="caution">');
    expect(renderMarkdownSync('> ### Caution: carbon monoxide\n>\n> Text.')).toContain('<blockquote class="caution">');
    expect(renderMarkdownSync('> A plain quote with **Caution** inside.')).toContain('<blockquote>');
  });

  it('accepts only the one class on blockquotes', () => {
    const html = sanitizeOnly({
      type: 'root',
      children: [{ type: 'element', tagName: 'blockquote', properties: { className: ['caution', 'fixed', 'inset-0'] }, children: [] }],
    });
    expect(html).toBe('<blockquote class="caution"></blockquote>');
  });
});

describe('pipeline order (MD-03)', () => {
  it('runs rehype-sanitize as the last transform, followed only by the serializer', () => {
    const plugins = createMarkdownProcessor().attachers.map(([plugin]) => plugin);
    const sanitizeAt = plugins.lastIndexOf(rehypeSanitize as never);
    expect(sanitizeAt).toBeGreaterThan(0);
    // Reviewed allowlist of what may follow the sanitizer: the stringifier only.
    const after = plugins.slice(sanitizeAt + 1);
    expect(after).toEqual([rehypeStringify]);
    // And it is used exactly once, with our schema.
    expect(plugins.filter((plugin) => plugin === (rehypeSanitize as never))).toHaveLength(1);
    const [, schema] = createMarkdownProcessor().attachers[sanitizeAt] ?? [];
    expect(schema).toBe(sanitizeSchema);
  });
});

import type { Metadata } from 'next';
import Link from 'next/link';
import { openApiDocument } from '@/lib/openapi/document';
import { apiGuide } from '@/lib/openapi/guide';
import { ERROR_MEANING, type ErrorStatus } from '@/lib/openapi/registry';
import { OperationBlock } from './operation';
import { FieldTable } from './field-table';
import { InlineText } from './rich-text';
import { areaId, readingsExample } from './example';

export const metadata: Metadata = {
  title: 'API guide',
  description: 'The Trailbench JSON API: every /api/v1 route, its parameters, media types, sign-in and error format, with a readings upload example.',
};

const ERROR_EXAMPLE = `{
  "error": {
    "code": "invalid",
    "message": "Some fields are not valid.",
    "fields": {
      "name": ["Give the item’s name (at least 2 characters)."]
    }
  }
}`;

export default function ApiGuidePage() {
  const doc = openApiDocument();
  const areas = apiGuide(doc);
  const example = readingsExample(doc);
  const sections = [
    { id: 'signing-in', label: 'Signing in' },
    { id: 'errors', label: 'Errors' },
    { id: 'example', label: 'Example: upload readings' },
    ...areas.map((a) => ({ id: areaId(a.tag), label: a.tag })),
  ];
  const operationCount = areas.reduce((n, a) => n + a.operations.length, 0);

  return (
    <main className="mx-auto w-full max-w-6xl px-4 py-10 sm:px-6">
      <header className="max-w-[70ch] border-b border-rule pb-6">
        <h1 className="text-3xl font-bold tracking-tight sm:text-4xl">API guide</h1>
        <p className="mt-3 text-lg leading-relaxed text-slate">
          Everything the site shows and records is also a JSON API under <code className="font-mono text-base">/api/v1</code>: public reads for your own
          tools, and writes for loggers and spreadsheet scripts. This page is drawn from the same document a program reads.
        </p>
        <p className="mt-3 text-sm text-slate">
          <span className="figure">{operationCount}</span> operations in <span className="figure">{areas.length}</span> areas · OpenAPI {doc.openapi}
          {' · '}
          <a href="/api/v1/openapi.json" className="font-semibold text-lichen underline underline-offset-2">
            openapi.json
          </a>
        </p>
      </header>

      <div className="mt-8 lg:grid lg:grid-cols-[13rem_minmax(0,1fr)] lg:gap-12">
        <nav aria-label="On this page" className="mb-8 lg:mb-0">
          <div className="border-l border-rule pl-4 lg:sticky lg:top-8">
            <p className="font-mono text-xs uppercase tracking-wide text-slate">On this page</p>
            <ul className="mt-3 space-y-2 text-sm">
              {sections.map((s) => (
                <li key={s.id}>
                  <a href={`#${s.id}`} className="text-slate hover:text-lichen hover:underline">
                    {s.label}
                  </a>
                </li>
              ))}
            </ul>
          </div>
        </nav>

        <div className="min-w-0 space-y-14">
          <section id="signing-in" aria-labelledby="signing-in-h" className="max-w-[70ch] scroll-mt-8">
            <h2 id="signing-in-h" className="text-2xl font-bold">
              Signing in
            </h2>
            <p className="mt-3 leading-relaxed">
              Reads of published gear, reviews and field tests need no account. Everything else acts as a person, in one of two ways:
            </p>
            <dl className="mt-4 space-y-4">
              <div className="rounded-md border border-rule bg-card p-4">
                <dt className="font-semibold">A personal API token (for scripts)</dt>
                <dd className="mt-1 leading-relaxed">
                  Send <code className="font-mono text-sm">Authorization: Bearer &lt;token&gt;</code>. Reviewers (and editors and admins) make tokens on their{' '}
                  <Link href="/account" className="font-semibold text-lichen underline underline-offset-2">
                    account page
                  </Link>
                  : each is named, shown once, and scoped <em>read</em> (public data plus your own drafts) or <em>write</em>. A token acts with its owner’s current
                  role, checked on every request, and stops working the moment it is revoked or the account is disabled. Keep it out of shared
                  spreadsheets and code.
                </dd>
              </div>
              <div className="rounded-md border border-rule bg-card p-4">
                <dt className="font-semibold">The browser session (for this site’s own pages)</dt>
                <dd className="mt-1 leading-relaxed">
                  The session cookie counts only for requests from this site: a write whose <code className="font-mono text-sm">Origin</code> is another
                  site is refused with 403.
                </dd>
              </div>
            </dl>
            <p className="mt-4 leading-relaxed">
              Each operation below says who may call it. Bodies go in the media type listed for the operation —{' '}
              <code className="font-mono text-sm">application/json</code> for most, <code className="font-mono text-sm">multipart/form-data</code> for
              photos, a CSV file for readings — and anything else is refused with 415.
            </p>
          </section>

          <section id="errors" aria-labelledby="errors-h" className="max-w-[70ch] scroll-mt-8">
            <h2 id="errors-h" className="text-2xl font-bold">
              Errors
            </h2>
            <p className="mt-3 leading-relaxed">
              Every refusal has the same body: a <code className="font-mono text-sm">code</code> for programs, a <code className="font-mono text-sm">message</code>{' '}
              for people, and for invalid bodies the <code className="font-mono text-sm">fields</code> that failed, keyed by their dotted path. Nothing is
              saved when a request fails.
            </p>
            <pre className="mt-4 overflow-x-auto rounded-md border border-rule bg-card p-4 font-mono text-sm leading-relaxed" tabIndex={0} aria-label="Example error body">
              <code>{ERROR_EXAMPLE}</code>
            </pre>
            <FieldTable
              caption="HTTP statuses of refusals"
              className="mt-4"
              head={['Status', 'Meaning']}
              rows={(Object.keys(ERROR_MEANING) as unknown as ErrorStatus[]).map((status) => [
                <span key="s" className="figure font-mono">
                  {status}
                </span>,
                <InlineText key="m" text={ERROR_MEANING[status]} />,
              ])}
            />
          </section>

          <section id="example" aria-labelledby="example-h" className="max-w-[70ch] scroll-mt-8">
            <h2 id="example-h" className="text-2xl font-bold">
              Example: upload a readings file
            </h2>
            <p className="mt-3 leading-relaxed">
              <InlineText text={example.intro} />
            </p>
            <pre className="mt-4 overflow-x-auto rounded-md border border-rule bg-card p-4 font-mono text-sm leading-relaxed" tabIndex={0} aria-label="Example log file, log.csv">
              <code>{example.csv}</code>
            </pre>
            <pre className="mt-3 overflow-x-auto rounded-md border border-rule bg-card p-4 font-mono text-sm leading-relaxed" tabIndex={0} aria-label="Example upload command">
              <code>{example.command}</code>
            </pre>
            <p className="mt-3 leading-relaxed text-slate">
              <InlineText text={example.outro} />
            </p>
          </section>

          {areas.map((area) => (
            <section key={area.tag} id={areaId(area.tag)} aria-labelledby={`${areaId(area.tag)}-h`} className="scroll-mt-8">
              <h2 id={`${areaId(area.tag)}-h`} className="border-b border-rule pb-2 text-2xl font-bold">
                {area.tag}
              </h2>
              {area.description ? (
                <p className="mt-3 max-w-[70ch] leading-relaxed text-slate">
                  <InlineText text={area.description} />
                </p>
              ) : null}
              <div className="mt-6 space-y-8">
                {area.operations.map((op) => (
                  <OperationBlock key={op.id} operation={op} />
                ))}
              </div>
            </section>
          ))}
        </div>
      </div>
    </main>
  );
}

import type { GuideOperation } from '@/lib/openapi/guide';
import { FieldList } from './field-list';
import { DescriptionText, InlineText } from './rich-text';

const ACCESS_TEXT: Record<GuideOperation['access'], string> = {
  account: 'Needs an account: a personal token, or this site’s session.',
  anyone: 'Open to anyone.',
  'anyone, more when signed in': 'Open to anyone; signed in, you also see your own unpublished records.',
};

function statusKind(status: string): string {
  if (status.startsWith('2')) return 'success';
  if (status.startsWith('3')) return 'nothing new, no body';
  if (status.startsWith('4')) return 'refused';
  return 'failed';
}

/** One route + method: what it does, who may call it, what it takes and what it answers. */
export function OperationBlock({ operation: op }: { operation: GuideOperation }) {
  const answers = op.responses.filter((r) => !/^[45]/.test(r.status));
  const refusals = op.responses.filter((r) => /^[45]/.test(r.status));
  return (
    <article id={op.id} aria-labelledby={`${op.id}-h`} className="scroll-mt-8 rounded-lg border border-rule p-3 sm:p-5">
      <h3 id={`${op.id}-h`} className="text-lg font-semibold">
        {op.summary}
      </h3>
      <p className="mt-1 font-mono text-sm break-all">
        <span className="mr-2 inline-block rounded border border-ink px-1.5 text-xs leading-5 font-semibold tracking-wide">{op.method}</span>
        {op.path}
      </p>
      <p className="mt-2 text-sm text-slate">{ACCESS_TEXT[op.access]}</p>
      {op.description ? <DescriptionText text={op.description} className="mt-3 max-w-[75ch]" /> : null}

      {op.parameters.length ? (
        <>
          <h4 className="mt-4 text-sm font-semibold">Parameters</h4>
          <div className="mt-2 rounded-md border border-rule">
            <FieldList label={`Parameters of ${op.method} ${op.path}`} fields={op.parameters} where />
          </div>
        </>
      ) : null}

      {op.bodies.length ? (
        <>
          <h4 className="mt-4 text-sm font-semibold">Body {op.bodies.length > 1 ? '(one of these media types)' : ''}</h4>
          <ul className="mt-2 space-y-2">
            {op.bodies.map((body) => (
              <li key={body.mediaType}>
                {body.fields.length ? (
                  <details className="group rounded-md border border-rule">
                    <summary className="cursor-pointer px-3 py-2 text-sm">
                      <code className="font-mono font-semibold">{body.mediaType}</code>
                      <span className="text-slate"> — {body.fields.length} fields</span>
                    </summary>
                    <div className="border-t border-rule">
                      <FieldList label={`${body.mediaType} body of ${op.method} ${op.path}`} fields={body.fields} />
                    </div>
                  </details>
                ) : (
                  <p className="text-sm">
                    <code className="font-mono font-semibold">{body.mediaType}</code>
                    <span className="text-slate"> — {body.shape}</span>
                  </p>
                )}
              </li>
            ))}
          </ul>
        </>
      ) : null}

      <h4 className="mt-4 text-sm font-semibold">Answers</h4>
      <ul className="mt-2 space-y-2 text-sm">
        {answers.map((r) => (
          <li key={r.status}>
            <span className="figure mr-2 font-mono font-semibold" aria-label={`${r.status}, ${statusKind(r.status)}`}>
              {r.status}
            </span>
            <InlineText text={r.description} />
            {r.fields.length ? (
              <details className="mt-2 rounded-md border border-rule">
                <summary className="cursor-pointer px-3 py-2">
                  Fields of the answer<span className="text-slate"> — {r.fields.length}</span>
                </summary>
                <div className="border-t border-rule">
                  <FieldList label={`${r.status} answer of ${op.method} ${op.path}`} fields={r.fields} />
                </div>
              </details>
            ) : null}
          </li>
        ))}
        {refusals.length ? (
          <li>
            <span className="text-slate">Refusals (error format): </span>
            <span className="figure font-mono">{refusals.map((r) => r.status).join(' · ')}</span>
          </li>
        ) : null}
      </ul>
    </article>
  );
}

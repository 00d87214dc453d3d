import type { GuideField } from '@/lib/openapi/guide';
import { InlineText } from './rich-text';

/** Fields (or parameters) as a list that reads the same on a phone as on a desk: name, then type and notes. */
export function FieldList({ label, fields, where }: { label: string; fields: (GuideField & { in?: string })[]; where?: boolean }) {
  return (
    <dl aria-label={label} className="divide-y divide-rule text-sm">
      {fields.map((f) => (
        <div key={`${f.in ?? ''}${f.name}`} className="grid gap-x-6 gap-y-0.5 px-3 py-2 sm:grid-cols-[minmax(9rem,15rem)_minmax(0,1fr)]">
          <dt className="font-mono break-all">{f.name}</dt>
          <dd>
            <span>{f.type}</span>
            <span className="text-slate"> · </span>
            {f.required ? <span className="font-semibold">required</span> : <span className="text-slate">optional</span>}
            {where && f.in ? <span className="text-slate"> · in {f.in}</span> : null}
            {f.notes ? (
              <p className="mt-0.5 break-words text-slate">
                <InlineText text={f.notes} />
              </p>
            ) : null}
          </dd>
        </div>
      ))}
    </dl>
  );
}

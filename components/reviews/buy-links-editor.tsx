'use client';

import Link from 'next/link';
import { useState, useTransition } from 'react';
import { Button, Field, FormMessage, TextInput } from '@/components/ui/form';
import { MAX_BUY_LINKS, type BuyLink } from '@/lib/reviews/buy-links';
import { saveBuyLinksAction, type BuyLinksFormState } from '@/lib/reviews/buy-links-actions';

/**
 * The author's where-to-buy links of the working revision: label, https address and whether it is an
 * affiliate link. Saved on its own (the server validates with the same zod schema); locked with the text.
 */
export function BuyLinksEditor({ reviewId, initial, editable }: { reviewId: string; initial: BuyLink[]; editable: boolean }) {
  const [links, setLinks] = useState<BuyLink[]>(initial);
  const [state, setState] = useState<BuyLinksFormState>({});
  const [pending, startTransition] = useTransition();
  const errorsOf = (i: number, key: keyof BuyLink) => state.fields?.[`links.${i}.${key}`];
  const update = (i: number, patch: Partial<BuyLink>) => setLinks((all) => all.map((l, j) => (j === i ? { ...l, ...patch } : l)));

  return (
    <section aria-labelledby="buy-links-heading" className="max-w-2xl" data-testid="buy-links-editor">
      <h2 id="buy-links-heading" className="text-lg font-semibold">
        Where to buy (optional)
      </h2>
      <p className="mt-1 text-sm text-slate">
        Shops readers can buy the gear from, shown under the review. Mark every link that may earn the site money as an affiliate link: readers see
        “affiliate link” beside it. See the{' '}
        <Link href="/disclosure" className="text-lichen underline">
          disclosure page
        </Link>
        .
      </p>
      {!editable ? (
        links.length ? (
          <ul className="mt-3 list-disc pl-5 text-sm">
            {links.map((l, i) => (
              <li key={i}>
                {l.label} — {l.url}
                {l.isAffiliate ? ' (affiliate link)' : ''}
              </li>
            ))}
          </ul>
        ) : (
          <p className="mt-3 text-sm">No links. They change with the text, in a draft or a correction.</p>
        )
      ) : (
        <form
          className="mt-4 space-y-4"
          onSubmit={(e) => {
            e.preventDefault();
            startTransition(async () => setState(await saveBuyLinksAction(reviewId, { links })));
          }}
        >
          {links.map((link, i) => (
            <fieldset key={i} className="grid gap-3 rounded-md border border-rule p-3 sm:grid-cols-[1fr_1.4fr]">
              <legend className="px-1 text-sm font-semibold">Link {i + 1}</legend>
              <Field id={`buy-${i}-label`} label="Shop or page" errors={errorsOf(i, 'label')}>
                <TextInput id={`buy-${i}-label`} value={link.label} maxLength={80} invalid={!!errorsOf(i, 'label')} onChange={(e) => update(i, { label: e.target.value })} />
              </Field>
              <Field id={`buy-${i}-url`} label="Address (https://…)" errors={errorsOf(i, 'url')}>
                <TextInput id={`buy-${i}-url`} type="url" inputMode="url" value={link.url} maxLength={500} invalid={!!errorsOf(i, 'url')} onChange={(e) => update(i, { url: e.target.value })} />
              </Field>
              <div className="flex flex-wrap items-center justify-between gap-3 sm:col-span-2">
                <label className="flex items-center gap-2 text-sm">
                  <input type="checkbox" checked={link.isAffiliate} onChange={(e) => update(i, { isAffiliate: e.target.checked })} />
                  Affiliate link (the site may earn from a purchase)
                </label>
                <Button type="button" variant="quiet" onClick={() => setLinks((all) => all.filter((_, j) => j !== i))}>
                  Remove link {i + 1}
                </Button>
              </div>
            </fieldset>
          ))}
          <div className="flex flex-wrap gap-3">
            {links.length < MAX_BUY_LINKS ? (
              <Button type="button" variant="quiet" onClick={() => setLinks((all) => [...all, { label: '', url: 'https://', isAffiliate: false }])}>
                Add a link
              </Button>
            ) : null}
            <Button type="submit" disabled={pending}>
              {pending ? 'Saving…' : 'Save links'}
            </Button>
          </div>
          <FormMessage message={state.message} tone={state.ok ? 'ok' : 'danger'} testId="buy-links-message" />
        </form>
      )}
    </section>
  );
}

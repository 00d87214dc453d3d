import Link from 'next/link';
import type { Figure, GearSummary } from '@/lib/browse/contract';
import { kindLabel } from '@/lib/gear/categories';
import { isCategory } from '@/lib/measure';
import { AddToSideBySide } from '../side-by-side/add-to-side-by-side';
import { figureText, priceText } from './figure-text';
import { RadioQuietBadge } from './radio-quiet-badge';
import { RoleNote } from './role-note';
import type { Category } from '@/lib/measure';

const BASIS = {
  measured: { mark: '●', text: 'measured' },
  claimed: { mark: '○', text: 'claimed' },
  mixed: { mark: '◐', text: 'measured and claimed' },
} as const;

export function BasisMark({ basis }: { basis: Figure['basis'] }) {
  const b = BASIS[basis];
  return (
    <span className="whitespace-nowrap font-mono text-[0.7rem] uppercase tracking-wide text-slate" data-testid="basis">
      <span aria-hidden="true">{b.mark} </span>
      {b.text}
    </span>
  );
}

interface Props {
  item: GearSummary;
  sort: { key: string; label: string } | null;
  imperial: boolean;
  headingLevel?: 3 | 4;
  /** The category browsed, when one is chosen (a lantern listed under power banks says it serves as one). */
  listedAs?: Category | null;
}

/** One browse result: photo, name, the figure sorted by (with its basis), mass, price and the side-by-side button. */
export function GearCard({ item, sort, imperial, headingLevel = 3, listedAs = null }: Props) {
  const Heading = headingLevel === 3 ? 'h3' : 'h4';
  const sorted: Figure | null = sort ? (sort.key === 'price' ? null : (item.specs[sort.key] ?? item.ratios[sort.key] ?? null)) : null;
  const mass = item.specs.mass;
  const kind = isCategory(item.category) ? kindLabel(item.category, item.kind) : item.kind;
  return (
    <li className="flex flex-wrap gap-x-4 gap-y-2 rounded-lg border border-rule bg-paper p-3 sm:flex-nowrap" data-testid="gear-card" data-slug={item.slug}>
      <div className="h-16 w-16 shrink-0 overflow-hidden rounded-md bg-card sm:h-20 sm:w-20">
        {item.photo ? (
          // eslint-disable-next-line @next/next/no-img-element -- served WebP variants from our own uploads route
          <img src={item.photo.src} alt={item.photo.alt} width={item.photo.width} height={item.photo.height} loading="lazy" className="h-full w-full object-cover" />
        ) : (
          <span className="flex h-full w-full items-center justify-center text-center text-xs text-slate">No photo yet</span>
        )}
      </div>
      <div className="min-w-0 flex-1 space-y-0.5">
        <p className="text-xs text-slate">
          {item.maker}
          {kind ? ` · ${kind}` : ''}
          {item.reviewed ? <span className="ml-2 rounded bg-lichen-tint px-1.5 py-0.5 font-semibold text-ink">Reviewed</span> : null}
        </p>
        <Heading className="font-semibold leading-snug">
          <Link href={item.path} className="hover:underline" data-testid="gear-card-name">
            {item.name}
          </Link>
        </Heading>
        <RoleNote item={item} listedAs={listedAs} />
        {sort ? (
          <p className="text-sm" data-testid="sorted-figure">
            <span className="text-slate">{sort.label}: </span>
            {sort.key === 'price' ? (
              <span className="figure font-mono font-semibold">{item.price ? priceText(item.price) : '—'}</span>
            ) : sorted ? (
              <>
                <span className="figure font-mono font-semibold" data-testid="sorted-value">
                  {figureText(sorted, imperial)}
                </span>{' '}
                <BasisMark basis={sorted.basis} />
              </>
            ) : (
              <span className="text-slate">not known</span>
            )}
          </p>
        ) : null}
        <p className="flex flex-wrap gap-x-4 gap-y-1 text-sm">
          {mass && sort?.key !== 'mass' ? (
            <span>
              <span className="figure font-mono">{figureText(mass, imperial)}</span> <BasisMark basis={mass.basis} />
            </span>
          ) : null}
          {item.price && sort?.key !== 'price' ? <span className="figure font-mono text-slate">{priceText(item.price)}</span> : null}
          {item.status ? <span className="rounded bg-amber-tint px-1.5 text-xs">Yours · {item.status}</span> : null}
        </p>
        <RadioQuietBadge specs={item.specs} />
      </div>
      <div className="w-full pl-20 sm:w-auto sm:shrink-0 sm:self-center sm:pl-0">
        <AddToSideBySide slug={item.slug} name={item.name} compact />
      </div>
    </li>
  );
}

export function GearCardSkeleton() {
  return (
    <li className="flex animate-pulse gap-4 rounded-lg border border-rule p-4" aria-hidden="true">
      <div className="h-16 w-16 rounded-md bg-card sm:h-20 sm:w-20" />
      <div className="flex-1 space-y-2">
        <div className="h-3 w-24 rounded bg-card" />
        <div className="h-4 w-48 rounded bg-card" />
        <div className="h-3 w-32 rounded bg-card" />
      </div>
    </li>
  );
}

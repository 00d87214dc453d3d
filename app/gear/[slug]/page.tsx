import type { Metadata } from 'next';
import Link from 'next/link';
import { CategoryCautions } from '@/components/gear/category-cautions';
import { LongTermTimeline } from '@/components/gear/long-term-timeline';
import { PortsList } from '@/components/gear/ports-list';
import { RadioNoiseSummary } from '@/components/gear/radio-noise-summary';
import { AlsoServesLine, RolesAndFeatures } from '@/components/gear/roles-and-features';
import { roleCautions, rolesOf } from '@/lib/gear/roles';
import { RatiosTable } from '@/components/gear/ratios-table';
import { ReviewActions } from '@/components/gear/review-actions';
import { SpecsTable } from '@/components/gear/specs-table';
import { StatusBadge, STATE_LABELS } from '@/components/gear/status-badge';
import { getDb } from '@/db';
import { canEditGear, getGearView, specHistory } from '@/db/gear';
import { countPhotos } from '@/db/photos';
import { measuredPortsOf } from '@/db/measured-ports';
import { PhotoGallery } from '@/components/photos/photo-gallery';
import { PhotoUploader } from '@/components/photos/photo-uploader';
import { AddToSideBySide } from '@/components/side-by-side/add-to-side-by-side';
import { getCurrentUser } from '@/lib/auth/guard';
import { CATEGORY_DEFS, CHEMISTRY_LABELS, kindLabel } from '@/lib/gear/categories';
import { formatMoney, formatQuantity } from '@/lib/gear/format';
import { orPageError } from '@/lib/gear/page-errors';
import { gearEditPath } from '@/lib/gear/paths';
import { isSpecKey, SPECS, type Chemistry } from '@/lib/measure';
import { getUnitSystem } from '@/lib/units/preference';
import { formatSpecIn } from '@/lib/units/format';

export const dynamic = 'force-dynamic';

const AIRLINE_TEXT = {
  'no-approval': 'Up to 100 Wh: allowed in carry-on without airline approval; spare packs in carry-on only.',
  approval: 'Over 100 Wh up to 160 Wh: needs the airline’s approval; at most two spares, carry-on only.',
  'cargo-only': 'Over 160 Wh: not allowed in passenger baggage; ships as cargo under dangerous-goods rules.',
} as const;

export async function generateMetadata({ params }: { params: Promise<{ slug: string }> }): Promise<Metadata> {
  const { slug } = await params;
  try {
    const view = getGearView(getDb(), slug, await getCurrentUser());
    return { title: view.version.name };
  } catch {
    return { title: 'Gear item' };
  }
}

export default async function GearItemPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const viewer = await getCurrentUser();
  const units = await getUnitSystem();
  const view = orPageError(() => getGearView(getDb(), slug, viewer));
  const { item, version } = view;
  const def = CATEGORY_DEFS[version.category];
  const price = version.priceMinor !== null && version.priceCurrency ? formatMoney({ amountMinor: version.priceMinor, currency: version.priceCurrency }) : null;
  const lastComment = view.events.find((e) => e.toState === 'changes-requested')?.comment;
  const history = view.insider && viewer ? specHistory(getDb(), slug, viewer) : [];
  const figure = (key: string, value: number | null) => (value === null ? '—' : isSpecKey(key) ? formatSpecIn(key, value, units) : String(value));
  const mayManagePhotos = canEditGear(viewer, item);
  const CONTEXT = { edit: 'draft edit', pending: 'pending change', approval: 'approved' } as const;

  return (
    <main className="mx-auto max-w-4xl space-y-10 px-4 py-10 sm:px-6">
      <header className="space-y-3">
        <p className="font-mono text-xs uppercase tracking-[0.2em] text-lichen">
          <Link href="/gear" className="hover:underline">
            {def.plural}
          </Link>
          {version.kind ? ` · ${kindLabel(version.category, version.kind)}` : ''}
        </p>
        <h1 className="text-3xl font-bold tracking-tight sm:text-4xl" data-testid="gear-name">
          {version.name}
        </h1>
        <p className="text-slate">
          {version.maker}
          {version.modelYear ? ` · model year ${version.modelYear}` : ''} · recorded by {item.ownerName}
        </p>
        <AlsoServesLine version={version} />
        {item.approvedAt !== null ? <AddToSideBySide slug={item.slug} name={version.name} /> : null}
        {view.insider ? (
          <div className="flex flex-wrap items-center gap-3">
            <StatusBadge status={item.status} />
            {view.permissions.canEdit ? (
              <Link href={gearEditPath(item.slug)} className="rounded-md border border-rule px-3 py-1.5 text-sm font-semibold hover:bg-card">
                Edit
              </Link>
            ) : null}
          </div>
        ) : null}
        {item.approvedAt === null ? (
          <p className="rounded-md bg-amber-tint px-3 py-2 text-sm" data-testid="draft-notice">
            Not public: only its author and the editors can see this item until it is approved ({STATE_LABELS[item.status].toLowerCase()}).
          </p>
        ) : view.hasPendingChange ? (
          <p className="rounded-md bg-amber-tint px-3 py-2 text-sm" data-testid="pending-notice">
            You are seeing a pending change ({STATE_LABELS[item.status].toLowerCase()}). Readers see the approved figures until an editor approves it.
          </p>
        ) : null}
        {item.status === 'changes-requested' && lastComment ? (
          <div className="rounded-md border border-danger bg-danger-tint px-3 py-2 text-sm" data-testid="send-back-comment">
            <strong>Editor&apos;s comment:</strong> {lastComment}
          </div>
        ) : null}
      </header>

      <ReviewActions slug={item.slug} canSubmit={view.permissions.canSubmit} canWithdraw={view.permissions.canWithdraw} canReview={view.permissions.canReview} />

      <section aria-labelledby="specs-heading" className="space-y-3">
        <h2 id="specs-heading" className="text-xl font-bold">
          Specs
        </h2>
        <SpecsTable def={def} lines={view.lines} units={units} />
        <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-2">
          {price ? (
            <div>
              <dt className="text-slate">Price paid</dt>
              <dd className="figure font-mono" data-testid="gear-price">
                {price}
                {version.pricePaidOn ? <span className="text-slate"> on {version.pricePaidOn}</span> : null}
              </dd>
            </div>
          ) : null}
          {version.chemistry ? (
            <div>
              <dt className="text-slate">Cell chemistry</dt>
              <dd>{CHEMISTRY_LABELS[version.chemistry as Chemistry] ?? version.chemistry}</dd>
            </div>
          ) : null}
          {version.waterRating ? (
            <div>
              <dt className="text-slate">Water rating (IEC 60529)</dt>
              <dd className="font-mono">{version.waterRating}</dd>
            </div>
          ) : null}
        </dl>
      </section>

      <RolesAndFeatures version={version} lines={view.lines} units={units} />

      <PortsList ports={version.ports} measured={measuredPortsOf(getDb(), item.id)} />

      <RadioNoiseSummary itemId={item.id} viewer={viewer} />

      <section aria-labelledby="ratios-heading" className="space-y-3">
        <h2 id="ratios-heading" className="text-xl font-bold">
          Value ratios
        </h2>
        <RatiosTable ratios={view.ratios} />
      </section>

      {view.airline ? (
        <section aria-labelledby="airline-heading" className="space-y-2 rounded-lg border border-rule p-4" data-testid="airline-band">
          <h2 id="airline-heading" className="text-lg font-bold">
            Flying with it
          </h2>
          <p>
            Rated energy <span className="figure font-mono font-semibold">{formatQuantity(view.airline.wh, 'Wh')}</span> (capacity × nominal voltage, as
            claimed). {AIRLINE_TEXT[view.airline.band]}
          </p>
          <p className="text-xs text-slate">From the rated energy, never a measured delivered figure (IATA passenger lithium battery table). Check with your airline.</p>
        </section>
      ) : null}

      {version.notes ? (
        <section aria-labelledby="notes-heading" className="space-y-2">
          <h2 id="notes-heading" className="text-xl font-bold">
            Notes
          </h2>
          <p className="whitespace-pre-line leading-relaxed">{version.notes}</p>
        </section>
      ) : null}

      {view.notes.length ? (
        <section aria-labelledby="updates-heading" className="space-y-2">
          <h2 id="updates-heading" className="text-xl font-bold">
            Figures updated
          </h2>
          <ul className="space-y-2 text-sm" data-testid="figure-notes">
            {view.notes.map((n) => (
              <li key={n.createdAt.toISOString()} className="border-l-2 border-rule pl-3">
                <time className="figure font-mono text-slate" dateTime={n.createdAt.toISOString()}>
                  {n.createdAt.toISOString().slice(0, 10)}
                </time>{' '}
                {n.summary}
                {n.note ? <span className="block text-slate">{n.note}</span> : null}
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      <LongTermTimeline item={item} viewer={viewer} />

      <section aria-labelledby="photos-heading" className="space-y-4">
        <h2 id="photos-heading" className="text-xl font-semibold">
          Photos
        </h2>
        <PhotoGallery gearItemId={item.id} slug={item.slug} itemName={version.name} manage={mayManagePhotos} />
        {mayManagePhotos ? <PhotoUploader slug={item.slug} photoCount={countPhotos(getDb(), item.id)} /> : null}
      </section>

      <CategoryCautions cautions={roleCautions(rolesOf(version.category, version.alsoServesAs))} />

      {history.length ? (
        <details className="rounded-lg border border-rule p-4 text-sm" data-testid="spec-history">
          <summary className="cursor-pointer font-semibold">Spec change history (author and editors)</summary>
          <table className="mt-3 w-full text-left">
            <thead className="text-xs uppercase tracking-wide text-slate">
              <tr>
                <th scope="col" className="py-1 pr-3">When</th>
                <th scope="col" className="py-1 pr-3">Who</th>
                <th scope="col" className="py-1 pr-3">Spec</th>
                <th scope="col" className="py-1 pr-3">Old → new</th>
                <th scope="col" className="py-1">Kind</th>
              </tr>
            </thead>
            <tbody>
              {history.map((h, i) => (
                <tr key={i} className="border-t border-rule">
                  <td className="py-1 pr-3 figure font-mono">{h.createdAt.toISOString().slice(0, 16).replace('T', ' ')}</td>
                  <td className="py-1 pr-3">{h.who ?? '—'}</td>
                  <td className="py-1 pr-3">
                    {isSpecKey(h.key) ? SPECS[h.key].label : h.key}
                    {h.mode ? ` (${h.mode})` : ''}
                  </td>
                  <td className="py-1 pr-3 figure font-mono">
                    {h.oldText !== null || h.newText !== null ? `${h.oldText ?? '—'} → ${h.newText ?? 'removed'}` : `${figure(h.key, h.oldValue)} → ${figure(h.key, h.newValue)}`}
                  </td>
                  <td className="py-1 text-slate">{CONTEXT[h.context]}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </details>
      ) : null}
    </main>
  );
}

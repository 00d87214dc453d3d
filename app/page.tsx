import Link from 'next/link';
import { getDb } from '@/db';
import { homeFigures } from '@/db/home';

export const dynamic = 'force-dynamic';

const CATEGORY_LABELS: Record<string, string> = {
  light: 'Lights',
  'power-bank': 'Power banks',
  'battery-12v': '12 V batteries',
  'solar-panel': 'Solar panels',
  radio: 'Radios',
  'cable-adapter': 'Cables and adapters',
  other: 'Other gear',
};

const steps = [
  { title: 'Claimed', text: 'The maker’s figure, with where it came from: packaging, manual or the maker’s site.' },
  { title: 'Measured', text: 'A field test on this site: date, sky, temperature, instrument, method and the raw readings.' },
  { title: 'Approved', text: 'An editor checks the test and the draft before any figure is shown to readers.' },
  { title: 'Compared', text: 'Value ratios — lumens per gram, watt-hours per unit of money — and measured against claimed.' },
];

export default function HomePage() {
  const figures = homeFigures(getDb());
  const items = figures.byCategory.reduce((sum, c) => sum + c.n, 0);
  return (
    <main className="mx-auto max-w-6xl px-4 sm:px-6">
      <section className="grid gap-10 py-14 md:grid-cols-[3fr_2fr] md:items-end">
        <div>
          <p className="font-mono text-xs uppercase tracking-[0.2em] text-lichen">Field journal · measured, not copied from the box</p>
          <h1 className="mt-4 text-4xl font-bold leading-tight tracking-tight sm:text-5xl">Gear tested in the field, compared by value.</h1>
          <p className="mt-5 max-w-xl text-lg text-slate">
            Lanterns, headlamps, power banks, 12 V batteries, folding solar panels and radios — measured by instructors on
            the trail, checked by an editor, and set side by side in lumens per gram and watt-hours per unit of money.
          </p>
          <div className="mt-8 flex flex-wrap gap-3">
            <Link href="/how-we-test" className="rounded-md bg-lichen px-4 py-2 font-semibold text-paper hover:bg-lichen-dark">
              How we test
            </Link>
            <Link href="/safety" className="rounded-md border border-rule px-4 py-2 font-semibold hover:bg-card">
              Safety cautions
            </Link>
          </div>
        </div>
        <dl className="grid grid-cols-3 gap-px overflow-hidden rounded-lg border border-rule bg-rule text-center" aria-label="On Trailbench now">
          {[
            { label: 'gear items', value: items },
            { label: 'field tests', value: figures.tests },
            { label: 'reviews', value: figures.reviews },
          ].map((f) => (
            <div key={f.label} className="bg-card px-3 py-5">
              <dt className="text-xs uppercase tracking-wide text-slate">{f.label}</dt>
              <dd className="figure mt-1 font-mono text-3xl font-semibold">{f.value}</dd>
            </div>
          ))}
        </dl>
      </section>

      <section aria-labelledby="path" className="border-t border-rule py-10">
        <h2 id="path" className="text-sm font-semibold uppercase tracking-wide text-slate">How a figure reaches you</h2>
        <ol className="mt-6 grid gap-6 sm:grid-cols-2 lg:grid-cols-4">
          {steps.map((step, i) => (
            <li key={step.title} className="border-l-2 border-lichen pl-4">
              <span className="font-mono text-xs text-slate">{String(i + 1).padStart(2, '0')}</span>
              <h3 className="mt-1 text-lg font-semibold">{step.title}</h3>
              <p className="mt-1 text-sm text-slate">{step.text}</p>
            </li>
          ))}
        </ol>
      </section>

      {figures.byCategory.length ? (
        <section aria-labelledby="shelves" className="border-t border-rule py-10">
          <h2 id="shelves" className="text-sm font-semibold uppercase tracking-wide text-slate">On the bench</h2>
          <ul className="mt-6 grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
            {figures.byCategory.map((c) => (
              <li key={c.category} className="flex items-baseline justify-between rounded-md border border-rule px-4 py-3">
                <span className="font-semibold">{CATEGORY_LABELS[c.category] ?? c.category}</span>
                <span className="figure font-mono text-slate">{c.n}</span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </main>
  );
}

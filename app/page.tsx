import { LogoMark } from '@/components/logo-mark';

export default function HomePage() {
  return (
    <main className="mx-auto max-w-3xl px-6 py-16">
      <div className="flex items-center gap-3 text-ink">
        <LogoMark className="h-10 w-10" />
        <span className="text-2xl font-bold tracking-tight">Trailbench</span>
      </div>
      <h1 className="mt-10 text-4xl font-bold tracking-tight">Gear tested in the field, compared by value.</h1>
      <p className="mt-4 text-lg text-slate">
        Lanterns, headlamps, power banks, 12 V batteries, folding solar panels and radios — measured by instructors on
        the trail, checked by an editor, and set side by side in lumens per gram and watt-hours per unit of money.
      </p>
    </main>
  );
}

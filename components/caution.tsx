import type { ReactNode } from 'react';

/** The caution mark (a red disc with "!"), the same as Markdown caution blocks; decorative. */
function CautionIcon() {
  return (
    <svg viewBox="0 0 20 20" className="h-5 w-5 flex-none" aria-hidden="true" focusable="false">
      <circle cx="10" cy="10" r="10" fill="currentColor" />
      <path d="M10 5v6" stroke="var(--color-danger-tint)" strokeWidth="2.2" strokeLinecap="round" />
      <circle cx="10" cy="14.6" r="1.3" fill="var(--color-danger-tint)" />
    </svg>
  );
}

type HeadingLevel = 2 | 3 | 4;

/**
 * A safety caution: icon, heading, short plain sentences, and the reminder to follow local
 * codes and the maker's instructions (on by default). Use it where the risk is — battery
 * pages, power budget results, wiring notes, fuel appliances, radio transmitting.
 * Markdown authors get the same look with a quote that opens with **Caution** (see
 * lib/markdown/plugins.ts, class "caution").
 */
export function Caution({
  title,
  children,
  level = 2,
  deferNote = true,
  className = '',
}: {
  title: string;
  children: ReactNode;
  level?: HeadingLevel;
  /** Adds "Follow local codes and the maker's instructions." at the end. */
  deferNote?: boolean;
  className?: string;
}) {
  const Heading = `h${level}` as const;
  return (
    <aside
      role="note"
      className={`rounded-r-md border-l-4 border-danger bg-danger-tint px-5 py-4 text-ink ${className}`}
    >
      <Heading className="flex items-center gap-2 text-base font-bold text-danger">
        <CautionIcon />
        {title}
      </Heading>
      <div className="mt-2 space-y-2 leading-relaxed">
        {children}
        {deferNote ? <p className="font-medium">Follow local codes and the maker&apos;s instructions.</p> : null}
      </div>
    </aside>
  );
}

/** Trailbench's mark: a bench-scale needle swinging over a trail line. Drawn here, inline SVG. */
export function LogoMark({ className = 'h-8 w-8' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true" focusable="false">
      <path d="M4 19a12 12 0 0 1 24 0" fill="none" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" />
      <path d="M9.5 13.6l1.3 1.3M16 10.5v1.9M22.5 13.6l-1.3 1.3" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
      <path d="M16 19l5.2-6.4" stroke="var(--color-lichen)" strokeWidth="2.6" strokeLinecap="round" />
      <circle cx="16" cy="19" r="2" fill="var(--color-lichen)" />
      <path d="M3 26c4-2.4 7-2.4 10 0s7 2.4 10 0 5-2 6-1.2" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" strokeDasharray="0.1 3.4" />
    </svg>
  );
}

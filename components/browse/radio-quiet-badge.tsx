import type { Figure } from '@/lib/browse/contract';
import { rangeVerdicts } from '@/lib/browse/radio-quiet';
import { formatNumber } from '@/lib/gear/format';
import type { RadioQuietVerdict } from '@/lib/measure';

const TONE: Record<RadioQuietVerdict, string> = {
  quiet: 'bg-lichen-tint',
  slight: 'bg-card',
  noisy: 'bg-amber-tint',
};

/**
 * The item's radio-noise verdict per tested range, small, on a gear card: the verdict word and the worst
 * band's rise in dB ("quiet below 30 MHz · 0.4 dB"); the word carries the meaning, the tint only repeats it.
 */
export function RadioQuietBadge({ specs }: { specs: Record<string, Figure> }) {
  const verdicts = rangeVerdicts(specs);
  if (verdicts.length === 0) return null;
  return (
    <p className="flex flex-wrap items-center gap-1.5 text-xs" data-testid="radio-quiet-verdicts">
      <span className="text-slate">Radio noise:</span>
      {verdicts.map((v) => (
        <span key={v.range} className={`rounded px-1.5 py-0.5 ${TONE[v.verdict]}`} data-testid={`radio-quiet-${v.range}`}>
          <span className="font-semibold">{v.verdict}</span> {v.rangeLabel} · <span className="figure font-mono">{formatNumber(v.riseDb)} dB</span>
        </span>
      ))}
    </p>
  );
}

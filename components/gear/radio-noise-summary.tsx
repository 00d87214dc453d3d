import Link from 'next/link';
import type { Actor } from '@/db/gear';
import { radioNoiseOfItem } from '@/db/radio-noise';
import { formatBandwidth } from '@/components/field-tests/radio-noise-results';
import { formatDb, RADIO_MODE_LABELS, RANGE_LABELS } from '@/lib/field-tests/radio-noise';
import { formatNumber } from '@/lib/gear/format';
import { radioQuietVerdict, RADIO_QUIET_WORDING, S_METER_RANGES, type RadioQuietVerdict } from '@/lib/measure';

const VERDICT_LABELS: Record<RadioQuietVerdict, string> = { quiet: 'Quiet', slight: 'Slight rise', noisy: 'Noisy' };
const VERDICT_TONES: Record<RadioQuietVerdict, string> = { quiet: 'border-lichen text-ink', slight: 'border-amber text-ink', noisy: 'border-danger text-danger' };

function Verdict({ verdict }: { verdict: RadioQuietVerdict }) {
  return <span className={`inline-block rounded border px-1.5 py-0.5 text-xs font-semibold ${VERDICT_TONES[verdict]}`}>{VERDICT_LABELS[verdict]}</span>;
}

/**
 * The item page's "Radio noise" section: from approved radio-noise checks, the verdict per S-meter range in
 * words, then each band's rise with a link to its test. Renders nothing for an item with no such check.
 */
export async function RadioNoiseSummary({ itemId, viewer }: { itemId: string; viewer: Actor | null }) {
  const data = await radioNoiseOfItem(itemId, viewer ? { viewerId: viewer.id } : {});
  if (!data) return null;
  const { summary, readings } = data;
  return (
    <section aria-labelledby="radio-noise-heading" className="space-y-4" data-testid="radio-noise-summary">
      <h2 id="radio-noise-heading" className="text-xl font-bold">
        Radio noise
      </h2>
      <p className="max-w-prose leading-relaxed">
        We listened to a radio receiver’s background hiss on each band, first with the radio on a quiet battery and then with this item powering it or
        running close by. The <strong>rise</strong> is how much louder the hiss got, in decibels (dB): 6 dB is one step (S-unit) on the radio’s signal meter,
        and a rise that large can bury weak stations.{' '}
        <Link className="text-lichen underline" href="/how-we-test#user-content-radio-noise">
          How we test radio noise
        </Link>
      </p>
      <dl className="grid gap-3 sm:grid-cols-2" data-testid="radio-noise-ranges">
        {S_METER_RANGES.map((range) => {
          const worst = summary.byRange[range];
          return (
            <div key={range} className="rounded-lg border border-rule p-3">
              <dt className="text-sm text-slate">{RANGE_LABELS[range]}</dt>
              {worst ? (
                <dd className="mt-1 space-y-1">
                  <p>
                    <Verdict verdict={worst.verdict} /> <span className="text-sm">{RADIO_QUIET_WORDING[worst.verdict]}</span>
                  </p>
                  <p className="figure text-sm">
                    Worst band: {worst.worstBand}, <strong>{formatDb(worst.worstRiseDb)} dB</strong> ({worst.bands} band{worst.bands === 1 ? '' : 's'} checked)
                  </p>
                </dd>
              ) : (
                <dd className="mt-1 text-sm text-slate">Not checked.</dd>
              )}
            </div>
          );
        })}
      </dl>
      <div className="overflow-x-auto rounded-lg border border-rule">
        <table className="w-full text-left text-sm" data-testid="radio-noise-bands">
          <caption className="sr-only">Noise rise per band</caption>
          <thead className="text-xs uppercase tracking-wide text-slate">
            <tr>
              <th scope="col" className="px-3 py-2">Band</th>
              <th scope="col" className="px-3 py-2">Frequency</th>
              <th scope="col" className="px-3 py-2">Mode</th>
              <th scope="col" className="px-3 py-2">Bandwidth</th>
              <th scope="col" className="px-3 py-2">Rise</th>
              <th scope="col" className="px-3 py-2">Verdict</th>
              <th scope="col" className="px-3 py-2">Test</th>
            </tr>
          </thead>
          <tbody>
            {readings.map((r, i) => (
              <tr key={`${r.fieldTestId}-${i}`} className="border-t border-rule" data-band={r.band}>
                <th scope="row" className="px-3 py-2 font-semibold">{r.band}</th>
                <td className="figure px-3 py-2">{formatNumber(r.frequencyMHz)} MHz</td>
                <td className="px-3 py-2">{RADIO_MODE_LABELS[r.mode]}</td>
                <td className="figure px-3 py-2">{formatBandwidth(r.bandwidthHz)}</td>
                <td className="figure px-3 py-2 font-semibold">{formatDb(r.riseDb)} dB</td>
                <td className="px-3 py-2"><Verdict verdict={radioQuietVerdict(r.riseDb)} /></td>
                <td className="px-3 py-2">
                  <Link className="underline" href={`/field-tests/${encodeURIComponent(r.fieldTestId)}`}>
                    <span className="sr-only">Field test of </span>
                    {r.testedAt.toISOString().slice(0, 10)}
                  </Link>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-xs text-slate">
        Readings from a receiver’s S-meter (IARU Region 1 Rec. R.1 scale); meters differ, and the antenna and the place matter, so compare items tested the same way.
        Listening needs no licence; transmitting on amateur bands does.
      </p>
    </section>
  );
}

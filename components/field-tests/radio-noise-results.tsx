import Link from 'next/link';
import { Caution } from '@/components/caution';
import type { TestRadioNoise } from '@/db/radio-noise';
import { formatDb, formatMeterReading, RADIO_MODE_LABELS, RANGE_LABELS } from '@/lib/field-tests/radio-noise';
import { formatNumber } from '@/lib/gear/format';
import { RADIO_QUIET_WORDING, S_METER_RANGES } from '@/lib/measure';

/** "2.4 kHz" / "500 Hz". */
export function formatBandwidth(hz: number): string {
  return hz >= 1000 ? `${formatNumber(hz / 1000)} kHz` : `${formatNumber(hz)} Hz`;
}

/** The transmit-licence caution shown with radio-noise results. */
export function RadioLicenceCaution({ level = 3 }: { level?: 2 | 3 | 4 }) {
  return (
    <Caution title="Listening only" level={level}>
      <p>A radio-noise check only listens. Transmitting on amateur radio bands needs a licence; check the rules of the country you are in.</p>
      <p>Keep the item under test away from the receiver’s antenna lead and power it as its maker says.</p>
    </Caution>
  );
}

/** A radio-noise check's band readings per item: each band's baseline, with-item level, rise and verdict. */
export function RadioNoiseResults({ data, items }: { data: TestRadioNoise; items: { id: string; name: string }[] }) {
  return (
    <section aria-labelledby="rn-results" className="space-y-4">
      <h2 id="rn-results" className="text-xl font-semibold">Band readings</h2>
      <p className="text-sm">
        Each row is one band: the receiver’s noise floor on a quiet reference supply, then with the item. The <strong>rise</strong> is the difference in dB;
        6 dB is one S-unit. <Link className="text-lichen underline" href="/how-we-test#user-content-radio-noise">How we test radio noise</Link>
      </p>
      {data.readings.length === 0 ? <p className="text-sm text-slate">No band readings yet.</p> : null}
      {items.map((item) => {
        const rows = data.readings.filter((r) => r.item.id === item.id);
        const summary = data.summaries.find((s) => s.itemId === item.id)?.summary;
        if (!rows.length || !summary) return null;
        return (
          <div key={item.id} className="space-y-2">
            <ul className="text-sm" data-testid="rn-test-verdicts">
              {S_METER_RANGES.map((range) => {
                const worst = summary.byRange[range];
                return worst ? (
                  <li key={range}>
                    <strong>{item.name}, {RANGE_LABELS[range].replace(/^B|^A/, (c) => c.toLowerCase())}:</strong> {worst.verdict} — {RADIO_QUIET_WORDING[worst.verdict]}; worst band {worst.worstBand}, {formatDb(worst.worstRiseDb)} dB.
                  </li>
                ) : null;
              })}
            </ul>
            <div className="overflow-x-auto rounded-lg border border-rule">
              <table className="w-full text-left text-sm" data-testid="rn-test-table">
                <caption className="bg-card px-3 py-2 text-left font-semibold">{item.name}</caption>
                <thead className="text-xs uppercase tracking-wide text-slate">
                  <tr>
                    <th scope="col" className="px-3 py-2">Band</th>
                    <th scope="col" className="px-3 py-2">Frequency, mode, bandwidth</th>
                    <th scope="col" className="px-3 py-2">Antenna, distance</th>
                    <th scope="col" className="px-3 py-2">Baseline</th>
                    <th scope="col" className="px-3 py-2">With the item</th>
                    <th scope="col" className="px-3 py-2">Rise</th>
                    <th scope="col" className="px-3 py-2">Verdict</th>
                  </tr>
                </thead>
                <tbody>
                  {rows.map((r) => (
                    <tr key={r.id} className="border-t border-rule">
                      <th scope="row" className="px-3 py-2 font-semibold">{r.band}</th>
                      <td className="figure px-3 py-2">{formatNumber(r.frequencyMHz)} MHz · {RADIO_MODE_LABELS[r.mode]} · {formatBandwidth(r.bandwidthHz)}</td>
                      <td className="px-3 py-2">{r.antenna || 'Antenna not noted'}; {formatNumber(r.distanceM)} m away</td>
                      <td className="figure whitespace-nowrap px-3 py-2">{formatMeterReading(r.baseline)}{r.baseline.scale === 's-meter' ? <span className="block text-xs text-slate">{formatDb(r.baselineDbm)} dBm</span> : null}</td>
                      <td className="figure whitespace-nowrap px-3 py-2">{formatMeterReading(r.withItem)}{r.withItem.scale === 's-meter' ? <span className="block text-xs text-slate">{formatDb(r.withItemDbm)} dBm</span> : null}</td>
                      <td className="figure whitespace-nowrap px-3 py-2 font-semibold">{formatDb(r.riseDb)} dB</td>
                      <td className="px-3 py-2">{r.verdict}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </div>
        );
      })}
      <p className="text-xs text-slate">
        S-meter readings are turned into dBm by IARU Region 1 Recommendation R.1 (S9 = −73 dBm below 30 MHz, −93 dBm above; 6 dB per S-unit). A reading is only as good as the
        meter: real S-meters stray from the scale, and the antenna and the place matter.
      </p>
      <RadioLicenceCaution />
    </section>
  );
}

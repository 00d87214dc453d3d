/**
 * What peak sun hours are, with example values and their source (check-values §10: annual mean daily
 * global horizontal irradiation computed from NREL typical-meteorological-year files bundled with pvlib-python).
 */
export const PSH_EXAMPLES = [
  { place: 'Albuquerque, New Mexico', value: 5.43 },
  { place: 'Miami, Florida', value: 4.91 },
  { place: 'Greensboro, North Carolina', value: 4.29 },
] as const;

export function PeakSunHelp({ onUseAllSky }: { onUseAllSky?: (value: number) => void }) {
  return (
    <details className="rounded-md border border-rule bg-card px-4 py-3 text-sm">
      <summary className="cursor-pointer font-semibold">What are peak sun hours?</summary>
      <div className="mt-2 space-y-2 leading-relaxed">
        <p>
          The sunlight of a whole day, counted as hours of full sun (1000 W per square metre, the light a panel is rated in). A day of 4 peak sun hours gives a 100 W panel about
          100 W × 4 h = 400 Wh before losses. It depends on the place, the season and the panel&apos;s angle; winter days give far fewer than summer days.
        </p>
        <p>
          Type the figure for a <strong>clear day</strong> at your place and season, then choose the sky you expect: the sky share scales the clear-day figure down.
        </p>
        <p>Yearly averages that already include cloudy days (all-sky), for a flat panel:</p>
        <ul className="list-disc pl-5">
          {PSH_EXAMPLES.map((e) => (
            <li key={e.place}>
              {e.place}: <span className="font-mono tabular-nums">{e.value}</span> h a day{' '}
              {onUseAllSky ? (
                <button type="button" className="ml-1 rounded border border-rule px-2 py-0.5 text-xs font-semibold hover:bg-paper" onClick={() => onUseAllSky(e.value)}>
                  Use {e.value} h (sets sky share to 1)
                </button>
              ) : null}
            </li>
          ))}
        </ul>
        <p className="text-slate">
          Source: annual mean daily global horizontal irradiation computed from NREL typical-meteorological-year files (TMY3 723650, TMY2 12839, TMY3 723170) bundled with pvlib-python. Because these averages already
          include cloud, use them only with the sky share set to 1. A tilted panel receives more than these flat-ground figures.
        </p>
      </div>
    </details>
  );
}

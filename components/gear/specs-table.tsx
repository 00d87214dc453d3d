import Link from 'next/link';
import type { SpecLine } from '@/db/gear';
import { SPECS } from '@/lib/measure';
import { CLAIM_SOURCE_LABELS, type CategoryDef, type ClaimSource } from '@/lib/gear/categories';
import { formatSignedPercent } from '@/lib/gear/format';
import type { UnitSystem } from '@/lib/units/display';
import { formatSpecIn } from '@/lib/units/format';

function specLabel(def: CategoryDef, line: SpecLine): string {
  const fromCategory = line.mode === '' ? def.specs.find((s) => s.key === line.key)?.label : undefined;
  if (fromCategory) return fromCategory;
  if (line.mode !== '') {
    const base = { luminousFlux: 'Light output', runtime: 'Runtime', powerDraw: 'Power draw' }[line.key as string] ?? SPECS[line.key].label;
    return base;
  }
  return SPECS[line.key].label;
}

/** Claimed and measured figures side by side, with measured ÷ claimed as a signed percentage. */
export function SpecsTable({ def, lines, units = 'metric' }: { def: CategoryDef; lines: SpecLine[]; units?: UnitSystem }) {
  const modes = [...new Set(lines.map((l) => l.mode))];
  return (
    <div className="overflow-x-auto rounded-lg border border-rule">
      <table className="w-full text-left text-sm" data-testid="specs-table">
        <caption className="sr-only">Specs: claimed and measured</caption>
        <thead className="bg-card text-xs uppercase tracking-wide text-slate">
          <tr>
            <th scope="col" className="sticky left-0 bg-card px-3 py-2">Spec</th>
            <th scope="col" className="px-3 py-2">Claimed</th>
            <th scope="col" className="px-3 py-2">Measured</th>
            <th scope="col" className="px-3 py-2">Measured vs claim</th>
          </tr>
        </thead>
        {modes.map((mode) => (
          <tbody key={mode || 'item'}>
            {mode !== '' ? (
              <tr className="border-t border-rule bg-card/50">
                <th scope="rowgroup" colSpan={4} className="px-3 py-1.5 text-xs font-semibold uppercase tracking-wide text-slate">
                  Mode: {mode}
                </th>
              </tr>
            ) : null}
            {lines
              .filter((l) => l.mode === mode)
              .map((line) => {
                const testId = `spec-${line.key}${line.mode ? `-${line.mode}` : ''}`;
                const ratio = line.claimed && line.measured && line.claimed.value > 0 ? line.measured.value / line.claimed.value : null;
                return (
                  <tr key={testId} className="border-t border-rule align-top" data-testid={testId}>
                    <th scope="row" className="sticky left-0 bg-paper px-3 py-2 font-semibold">
                      {specLabel(def, line)}
                    </th>
                    <td className="px-3 py-2 text-slate" data-testid={`${testId}-claimed`}>
                      {line.claimed ? (
                        <>
                          <span className="figure font-mono">{formatSpecIn(line.key, line.claimed.value, units)}</span>{' '}
                          <span className="ml-1 rounded border border-rule px-1 text-[10px] uppercase tracking-wide">claimed</span>{' '}
                          <span className="text-xs">· {CLAIM_SOURCE_LABELS[line.claimed.source as ClaimSource] ?? line.claimed.source}</span>
                        </>
                      ) : (
                        '—'
                      )}
                    </td>
                    <td className="px-3 py-2" data-testid={`${testId}-measured`}>
                      {line.measured ? (
                        <>
                          <span className="figure font-mono font-semibold">
                            {formatSpecIn(line.key, line.measured.value, units, line.measured.sd)}
                          </span>
                          {line.measured.n !== null && line.measured.n > 1 ? <span className="ml-1 text-xs text-slate">(n = {line.measured.n})</span> : null}
                          {line.measured.fieldTestId ? (
                            <Link href={`/field-tests/${encodeURIComponent(line.measured.fieldTestId)}`} className="ml-2 text-xs text-lichen underline">
                              field test
                            </Link>
                          ) : null}
                        </>
                      ) : (
                        <span className="text-slate">—</span>
                      )}
                    </td>
                    <td className="px-3 py-2 figure font-mono" data-testid={`${testId}-vs-claim`}>
                      {ratio !== null ? `${formatSignedPercent(ratio)} vs claim` : '—'}
                    </td>
                  </tr>
                );
              })}
          </tbody>
        ))}
      </table>
    </div>
  );
}

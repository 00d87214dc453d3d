import type { ValueRatio } from '@/lib/measure';
import { ratioLabel } from '@/lib/gear/categories';
import { formatRatio } from '@/lib/gear/format';

const BASIS: Record<ValueRatio['basis'], string> = { measured: 'from measured figures', claimed: 'from claimed figures', mixed: 'measured and claimed' };

/** Value ratios with their units and which figures they come from (measured ÷ claimed is in the specs table). */
export function RatiosTable({ ratios }: { ratios: ValueRatio[] }) {
  const shown = ratios.filter((r) => !r.id.startsWith('measured-vs-claimed:'));
  if (shown.length === 0) return <p className="text-sm text-slate">No value ratios yet: they need the mass, price and output figures of this category.</p>;
  return (
    <div className="overflow-x-auto rounded-lg border border-rule">
      <table className="w-full text-left text-sm" data-testid="ratios-table">
        <caption className="sr-only">Value ratios</caption>
        <thead className="bg-card text-xs uppercase tracking-wide text-slate">
          <tr>
            <th scope="col" className="px-3 py-2">Value ratio</th>
            <th scope="col" className="px-3 py-2">Value</th>
            <th scope="col" className="px-3 py-2">Basis</th>
          </tr>
        </thead>
        <tbody>
          {shown.map((r) => (
            <tr key={r.id} className="border-t border-rule" data-testid={`ratio-${r.id}`}>
              <th scope="row" className="px-3 py-2 font-semibold">
                {ratioLabel(r.id)}
              </th>
              <td className="px-3 py-2 figure font-mono" data-testid={`ratio-${r.id}-value`}>
                {formatRatio(r.value, r.unit)}
              </td>
              <td className="px-3 py-2 text-slate">{BASIS[r.basis]}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

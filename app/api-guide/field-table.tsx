import type { ReactNode } from 'react';

/** A table that scrolls sideways on narrow screens (focusable, so the keyboard can scroll it too). */
export function FieldTable({ caption, head, rows, className = '' }: { caption: string; head: string[]; rows: ReactNode[][]; className?: string }) {
  return (
    <div className={`overflow-x-auto rounded-md border border-rule ${className}`} tabIndex={0} role="region" aria-label={caption}>
      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-card">
          <tr>
            {head.map((h) => (
              <th key={h} scope="col" className="px-3 py-2 font-semibold whitespace-nowrap">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((cells, i) => (
            <tr key={i} className="border-t border-rule align-top">
              {cells.map((cell, j) => (
                <td key={j} className="px-3 py-2">
                  {cell}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

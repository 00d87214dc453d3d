import type { Figure } from '@/lib/browse/contract';
import { formatMoney, formatQuantity, formatRatio } from '@/lib/gear/format';

/** A figure as text, in imperial display units when the API sent them and they were asked for. */
export function figureText(figure: Figure, imperial: boolean): string {
  if (imperial && figure.imperial) return formatQuantity(figure.imperial.value, figure.imperial.unit);
  if (figure.unit === 's' || figure.unit === 'g' || figure.unit === 'm') return formatQuantity(figure.value, figure.unit);
  if (figure.unit === '') return formatRatio(figure.value, '');
  return formatRatio(figure.value, figure.unit);
}

export function priceText(price: { minor: number; currency: string }): string {
  return formatMoney({ amountMinor: price.minor, currency: price.currency });
}

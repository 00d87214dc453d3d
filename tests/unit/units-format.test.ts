import { describe, expect, it } from 'vitest';
import { formatFigure, formatSpecIn } from '@/lib/units/format';

// 1 lb = 453.592 37 g and 1 yd = 0.9144 m exactly (international yard and pound agreement, 1959; NIST HB 44 App. C),
// so 1 oz = 28.349 523 125 g, 1 ft = 0.3048 m, 1 in = 25.4 mm.
describe('figures in the viewer’s units', () => {
  it('metric figures are shown as stored', () => {
    expect(formatSpecIn('mass', 410, 'metric')).toBe('410 g');
    expect(formatSpecIn('mass', 410, 'metric', 5)).toBe('410 g ± 5 g');
  });

  it('masses under a pound in oz, from a pound in lb', () => {
    expect(formatSpecIn('mass', 410, 'imperial')).toBe('14.46 oz'); // 410 / 28.349523125 = 14.4623…
    expect(formatSpecIn('mass', 1000, 'imperial')).toBe('2.2 lb'); // 1000 / 453.59237 = 2.2046…
    expect(formatFigure(453.59237, 'g', 'imperial')).toBe('1 lb');
  });

  it('a spread is converted by the factor alone, in the same unit as its mean', () => {
    expect(formatSpecIn('mass', 410, 'imperial', 5)).toBe('14.46 oz ± 0.176 oz'); // 5 / 28.349523125 = 0.17637…
  });

  it('lengths under a foot in in, from a foot in ft; units without an imperial display unchanged', () => {
    expect(formatFigure(0.2, 'm', 'imperial')).toBe('7.87 in'); // 200 / 25.4 = 7.874…
    expect(formatFigure(1.2, 'm', 'imperial')).toBe('3.94 ft'); // 1.2 / 0.3048 = 3.937…
    expect(formatFigure(300, 'lm', 'imperial')).toBe('300 lm');
    expect(formatSpecIn('runtime', 18_000, 'imperial')).toBe('5 h');
  });
});

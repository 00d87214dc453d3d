/**
 * Sky share: a panel's output under the expected sky ÷ the same panel's output under a clear sky.
 * Paired field tests of the same panel give it best; otherwise these rough defaults apply.
 */
export const SKIES = ['clear', 'thin-cloud', 'broken-cloud', 'overcast', 'rain'] as const;
export type Sky = (typeof SKIES)[number];

export const SKY_LABELS: Readonly<Record<Sky, string>> = {
  clear: 'Clear sky',
  'thin-cloud': 'Thin cloud',
  'broken-cloud': 'Broken cloud',
  overcast: 'Overcast',
  rain: 'Rain',
};

/**
 * Rough sky shares when no paired field test exists: common practice, no source. They are
 * round planning figures, not measurements; a paired test of your own panel beats them.
 */
export const COMMON_PRACTICE_SKY_SHARE: Readonly<Record<Sky, number>> = {
  clear: 1,
  'thin-cloud': 0.75,
  'broken-cloud': 0.5,
  overcast: 0.25,
  rain: 0.1,
};

export function isSky(value: unknown): value is Sky {
  return typeof value === 'string' && (SKIES as readonly string[]).includes(value);
}

export interface SkyShareSuggestion {
  share: number;
  source: 'paired-test' | 'common-practice';
  note: string;
}

/**
 * The sky share to suggest for `sky`, given the paired-test shares of the kit's panels (mean of
 * the panels that have one), else the common-practice default.
 */
export function suggestSkyShare(sky: Sky, paired: readonly { sky: Sky; share: number; note: string }[]): SkyShareSuggestion {
  if (sky === 'clear') return { share: 1, source: 'paired-test', note: 'Clear sky is the reference: share 1 by definition.' };
  const matches = paired.filter((p) => p.sky === sky);
  if (matches.length > 0) {
    const share = matches.reduce((sum, p) => sum + p.share, 0) / matches.length;
    return { share: Number(share.toFixed(3)), source: 'paired-test', note: `From paired field tests: ${matches.map((m) => m.note).join('; ')}.` };
  }
  return {
    share: COMMON_PRACTICE_SKY_SHARE[sky],
    source: 'common-practice',
    note: 'Common practice, no source: a rough planning figure, no paired field test of these panels under this sky.',
  };
}

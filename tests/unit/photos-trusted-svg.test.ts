import { describe, expect, it } from 'vitest';
import { applyDecoderAllowlist, renderTrustedSvg } from '@/lib/photos/process';

const svg = (n: number) =>
  `<svg xmlns="http://www.w3.org/2000/svg" width="${200 + n}" height="120"><rect width="100%" height="100%" fill="#2f6b4f"/></svg>`;

describe('trusted SVG rendering under the decoder allowlist', () => {
  it('overlapping renders never close the SVG loader under one another (demo seed draws four at a time)', async () => {
    applyDecoderAllowlist();
    const images = await Promise.all(Array.from({ length: 12 }, (_, n) => renderTrustedSvg(svg(n))));
    expect(images).toHaveLength(12);
    for (const png of images) expect(png.subarray(1, 4).toString('latin1')).toBe('PNG');
  });
});

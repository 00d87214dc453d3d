import { describe, expect, it, vi } from 'vitest';
import { RADIO_QUIET_THRESHOLDS_DB, RADIO_QUIET_WORDING, S9_DBM, DB_PER_S_UNIT, sMeterToDbm } from '@/lib/measure';

// `server-only` throws outside a React Server Components bundle; vitest is not one.
vi.mock('server-only', () => ({}));
const { getContentPage } = await import('@/lib/content/pages');

/** The method page's text without tags (the rendered HTML, as a reader sees it). */
async function methodText(): Promise<{ html: string; text: string }> {
  const page = await getContentPage('how-we-test');
  return { html: page.html, text: page.html.replace(/<[^>]+>/g, ' ').replace(/\s+/g, ' ') };
}

describe('method page: radio noise', () => {
  it('has the section at the anchor #radio-noise (sanitizer-prefixed id) and lists it under "On this page"', async () => {
    const page = await getContentPage('how-we-test');
    expect(page.html).toContain('<h2 id="user-content-radio-noise">Radio noise</h2>');
    expect(page.headings).toContainEqual({ id: 'user-content-radio-noise', text: 'Radio noise' });
    expect(page.html).toContain('<h3 id="user-content-radio-noise-check">Radio-noise check</h3>');
  });

  it('quotes the verdict thresholds the code uses (RADIO_QUIET_THRESHOLDS_DB, our own convention)', async () => {
    const { text } = await methodText();
    expect(text).toContain(`under ${RADIO_QUIET_THRESHOLDS_DB.quietBelow} dB`);
    expect(text).toContain(`${RADIO_QUIET_THRESHOLDS_DB.quietBelow} dB to under ${RADIO_QUIET_THRESHOLDS_DB.slightBelow} dB`);
    expect(text).toContain(`${RADIO_QUIET_THRESHOLDS_DB.slightBelow} dB or more`);
    expect(text).toContain('common practice, no source');
    // The table's meanings are the code's wording without its bracketed figures.
    for (const wording of Object.values(RADIO_QUIET_WORDING)) expect(text).toContain(wording.replace(/ \(.*\)$/, ''));
  });

  it('states the IARU Region 1 R.1 scale the conversion uses, with worked values that match sMeterToDbm', async () => {
    const { text } = await methodText();
    expect(text).toContain('IARU Region 1 Technical Recommendation R.1');
    expect(text).toContain(`S9 = −${-S9_DBM['below-30mhz']} dBm below 30 MHz`);
    expect(text).toContain(`S9 = −${-S9_DBM['above-30mhz']} dBm above 30 MHz`);
    expect(text).toContain(`${DB_PER_S_UNIT} dB`);
    // Worked values of check-values.md §12 (IARU Region 1 R.1): HF S5 = −97 dBm, S9+20 = −53 dBm; VHF S7 = −105 dBm.
    expect(sMeterToDbm(5, 0, 'below-30mhz')).toBe(-97);
    expect(text).toContain('S5 = −97 dBm');
    expect(sMeterToDbm(9, 20, 'below-30mhz')).toBe(-53);
    expect(text).toContain('S9 + 20 dB = −53 dBm');
    expect(sMeterToDbm(7, 0, 'above-30mhz')).toBe(-105);
    expect(text).toContain('S7 = −105 dBm');
    // S3 → S5 below 30 MHz is a 12 dB rise (check-values.md §12).
    expect(sMeterToDbm(5, 0, 'below-30mhz') - sMeterToDbm(3, 0, 'below-30mhz')).toBe(12);
    expect(text).toContain('2 × 6 = 12 dB');
  });

  it('says what the figure cannot tell and that transmitting needs a licence', async () => {
    const { text } = await methodText();
    expect(text).toMatch(/Meters differ and are rarely calibrated/);
    expect(text).toMatch(/Antennas, locations and time of day matter/);
    expect(text).toMatch(/not absolute noise/);
    expect(text).toMatch(/transmitting on amateur radio bands needs an amateur licence/);
  });
});

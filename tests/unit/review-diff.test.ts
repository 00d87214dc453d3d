import { describe, expect, it } from 'vitest';
import { diffWords } from 'diff';
import { diffRevisions, diffText, elideUnchanged, MAX_WORD_EDITS } from '@/lib/reviews/diff';

/*
 * Expected parts follow jsdiff's documented diffWords behaviour (npm `diff` 9.0.0 README, "diffWords":
 * each word and punctuation mark is a token, whitespace ignored for matching but kept in the output).
 */
const visible = (parts: { kind: string; text: string }[]) => parts.map((p) => `${p.kind}:${p.text}`);

describe('diffText', () => {
  it('marks a changed word as removed then added, the rest unchanged', () => {
    const d = diffText('It ran for five hours.', 'It ran for six hours.');
    expect(visible(d.parts)).toEqual(['same:It ran for ', 'removed:five', 'added:six', 'same: hours.']);
    expect(d).toMatchObject({ granularity: 'word', changed: true, added: 1, removed: 1 });
  });

  it('treats punctuation as its own token', () => {
    expect(visible(diffText('Bright, warm light', 'Bright warm light').parts)).toEqual(['same:Bright', 'removed:,', 'same: warm light']);
  });

  it('keeps every word: old = same + removed, new = same + added (whitespace kept "as far as possible", README)', () => {
    const older = 'The bank delivered 20.1 Wh of its 22.2 Wh rating at 21 °C.\n\nIt charged in 3 h.';
    const newer = 'The bank delivered 19.8 Wh of its rated 22.2 Wh at 21 °C.\n\nIt charged in 3 h 10 min.';
    const d = diffText(older, newer, { elide: false });
    const squash = (t: string) => t.replace(/\s+/g, '');
    expect(squash(d.parts.filter((p) => p.kind !== 'added').map((p) => p.text).join(''))).toBe(squash(older));
    expect(squash(d.parts.filter((p) => p.kind !== 'removed').map((p) => p.text).join(''))).toBe(squash(newer));
    expect(d.parts.length).toBe(diffWords(older, newer).filter((c) => c.value).length);
  });

  it('reports no change for equal texts', () => {
    expect(diffText('same', 'same')).toMatchObject({ changed: false, added: 0, removed: 0, parts: [{ kind: 'same', text: 'same' }] });
    expect(diffText('', '')).toMatchObject({ changed: false, parts: [] });
  });

  it('falls back to whole lines when two long texts differ in almost every word', () => {
    const a = Array.from({ length: MAX_WORD_EDITS * 2 }, (_, i) => `a${i}`).join(' ');
    const b = Array.from({ length: MAX_WORD_EDITS * 2 }, (_, i) => `b${i}`).join(' ');
    const d = diffText(a, b);
    expect(d.granularity).toBe('line');
    expect(visible(d.parts)).toEqual([`removed:${a}`, `added:${b}`]);
  });
});

describe('elideUnchanged', () => {
  it('shortens a long unchanged run between changes to its ends and counts the hidden words', () => {
    const middle = Array.from({ length: 200 }, (_, i) => `w${i}`).join(' ');
    const parts = elideUnchanged([
      { kind: 'removed', text: 'x' },
      { kind: 'same', text: ` ${middle} ` },
      { kind: 'added', text: 'y' },
    ]);
    expect(parts.map((p) => p.kind)).toEqual(['removed', 'same', 'elided', 'same', 'added']);
    const shownWords = (parts[1]!.text + parts[3]!.text).match(/\S+/g)!.length;
    expect(parts[2]!.text).toBe(`${200 - shownWords} unchanged words`);
  });

  it('keeps only the side next to a change at the start and end of a text', () => {
    const long = 'word '.repeat(200);
    expect(elideUnchanged([{ kind: 'same', text: long }, { kind: 'added', text: 'z' }]).map((p) => p.kind)).toEqual(['elided', 'same', 'added']);
    expect(elideUnchanged([{ kind: 'added', text: 'z' }, { kind: 'same', text: long }]).map((p) => p.kind)).toEqual(['added', 'same', 'elided']);
  });
});

describe('diffRevisions', () => {
  it('diffs each field in reading order', () => {
    const base = { title: 'T', summary: 'S', verdict: 'V', body: 'B', disclosureLabel: 'Bought at retail', disclosureNote: '' };
    const d = diffRevisions(base, { ...base, verdict: 'V2', disclosureLabel: 'Loaned by the maker' });
    expect(d.map((f) => f.field)).toEqual(['title', 'summary', 'verdict', 'disclosureLabel', 'disclosureNote', 'body']);
    expect(d.filter((f) => f.changed).map((f) => f.field)).toEqual(['verdict', 'disclosureLabel']);
  });
});

/*
 * Demo photos: one simple drawing per approved demo gear item, made with sharp from SVG written here
 * (stylised shapes by category; no photos, logos or likenesses of real products). The drawing goes
 * through the same pipeline as an upload, so the stored files are ordinary photo variants.
 * Idempotent: a stable photo id per item; a run re-creates missing files and inserts missing rows only.
 */
import { eq } from 'drizzle-orm';
import { existsSync } from 'node:fs';
import type { Db } from '../connection';
import { gearItems, photos } from '../schema';
import { STORED_WIDTHS } from '../../lib/photos/config';
import { processAndStorePhoto, renderTrustedSvg } from '../../lib/photos/process';
import { variantPath } from '../../lib/photos/storage';
import { DEMO_GEAR, type DemoGearItem } from './demo-data';

const W = 1200;
const H = 900;
/** Stored at 960 px wide: enough for the gallery, and quicker to seed at startup. */
const SCALE = 0.8;

interface Palette {
  accent: string;
  body: string;
  dark: string;
  sky: string;
}

const PALETTES: Palette[] = [
  { accent: '#2f6b4f', body: '#4b7f66', dark: '#1f2420', sky: '#e3ece4' },
  { accent: '#b5651d', body: '#c9803a', dark: '#2b2622', sky: '#f1e6d6' },
  { accent: '#2d5d7b', body: '#47799a', dark: '#1c2630', sky: '#dfe9f0' },
  { accent: '#7a4e7e', body: '#93689a', dark: '#261f28', sky: '#ece3ee' },
  { accent: '#6b6b2f', body: '#87874a', dark: '#23241c', sky: '#ecebdc' },
];

function paletteFor(slug: string): Palette {
  let h = 0;
  for (const ch of slug) h = (h * 31 + ch.charCodeAt(0)) >>> 0;
  return PALETTES[h % PALETTES.length] ?? PALETTES[0]!;
}

function frame(p: Palette, content: string): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${W * SCALE}" height="${H * SCALE}" viewBox="0 0 ${W} ${H}">
  <defs>
    <linearGradient id="sky" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="${p.sky}"/><stop offset="1" stop-color="#f6f3ec"/></linearGradient>
    <radialGradient id="glow" cx="0.5" cy="0.5" r="0.5"><stop offset="0" stop-color="#fff6c8"/><stop offset="0.55" stop-color="#ffd866"/><stop offset="1" stop-color="#ffd866" stop-opacity="0"/></radialGradient>
    <linearGradient id="beam" x1="0" y1="0" x2="1" y2="0"><stop offset="0" stop-color="#ffe680" stop-opacity="0.85"/><stop offset="1" stop-color="#ffe680" stop-opacity="0"/></linearGradient>
  </defs>
  <rect width="${W}" height="${H}" fill="url(#sky)"/>
  <path d="M0 690 C 300 650 500 720 760 680 S 1100 660 1200 690 L1200 900 L0 900 Z" fill="#d6cfbf"/>
  <ellipse cx="600" cy="730" rx="330" ry="34" fill="${p.dark}" opacity="0.15"/>
  ${content}
</svg>`;
}

const lantern = (p: Palette) => `
  <circle cx="600" cy="420" r="260" fill="url(#glow)"/>
  <path d="M520 215 Q600 120 680 215" fill="none" stroke="${p.dark}" stroke-width="14" stroke-linecap="round"/>
  <rect x="500" y="215" width="200" height="60" rx="18" fill="${p.body}"/>
  <rect x="515" y="275" width="170" height="290" rx="40" fill="#fff3c4" stroke="${p.dark}" stroke-width="8"/>
  <line x1="560" y1="285" x2="560" y2="555" stroke="${p.dark}" stroke-width="6" opacity="0.35"/>
  <line x1="640" y1="285" x2="640" y2="555" stroke="${p.dark}" stroke-width="6" opacity="0.35"/>
  <rect x="485" y="565" width="230" height="150" rx="22" fill="${p.body}"/>
  <circle cx="600" cy="640" r="22" fill="${p.accent}" stroke="#f6f3ec" stroke-width="6"/>`;

const headlamp = (p: Palette) => `
  <polygon points="700,420 1150,250 1150,640" fill="url(#beam)"/>
  <ellipse cx="520" cy="440" rx="260" ry="150" fill="none" stroke="${p.accent}" stroke-width="34"/>
  <rect x="600" y="350" width="130" height="170" rx="30" fill="${p.body}" stroke="${p.dark}" stroke-width="8"/>
  <circle cx="690" cy="435" r="44" fill="#fff6c8" stroke="${p.dark}" stroke-width="8"/>
  <rect x="615" y="370" width="34" height="18" rx="6" fill="${p.dark}"/>`;

const torch = (p: Palette) => `
  <polygon points="860,450 1200,300 1200,600" fill="url(#beam)"/>
  <rect x="300" y="400" width="430" height="100" rx="30" fill="${p.body}" stroke="${p.dark}" stroke-width="8"/>
  <path d="M730 380 L860 360 L860 540 L730 520 Z" fill="${p.accent}" stroke="${p.dark}" stroke-width="8"/>
  <ellipse cx="860" cy="450" rx="22" ry="90" fill="#fff6c8" stroke="${p.dark}" stroke-width="6"/>
  <rect x="470" y="380" width="60" height="24" rx="8" fill="${p.dark}"/>
  ${[340, 380, 420, 620, 660, 700].map((x) => `<line x1="${x}" y1="410" x2="${x}" y2="490" stroke="${p.dark}" stroke-width="5" opacity="0.3"/>`).join('')}`;

const powerBank = (p: Palette) => `
  <rect x="380" y="250" width="440" height="460" rx="56" fill="${p.body}" stroke="${p.dark}" stroke-width="10"/>
  <rect x="430" y="300" width="340" height="250" rx="24" fill="${p.accent}" opacity="0.55"/>
  ${[0, 1, 2, 3].map((i) => `<circle cx="${510 + i * 60}" cy="620" r="16" fill="${i < 3 ? '#9be3a8' : '#f6f3ec'}" stroke="${p.dark}" stroke-width="4"/>`).join('')}
  <rect x="470" y="225" width="90" height="30" rx="8" fill="${p.dark}"/>
  <rect x="620" y="225" width="70" height="30" rx="14" fill="${p.dark}"/>
  <path d="M600 360 L560 440 L600 440 L585 500 L645 410 L605 410 L625 360 Z" fill="#f6f3ec"/>`;

const battery12v = (p: Palette) => `
  <rect x="330" y="330" width="540" height="380" rx="26" fill="${p.body}" stroke="${p.dark}" stroke-width="10"/>
  <rect x="330" y="330" width="540" height="70" rx="20" fill="${p.dark}"/>
  <rect x="420" y="290" width="70" height="50" rx="8" fill="#b23a2b"/>
  <rect x="710" y="290" width="70" height="50" rx="8" fill="#2b2b2b"/>
  <path d="M440 250 h30 M455 235 v30" stroke="#b23a2b" stroke-width="10" stroke-linecap="round"/>
  <path d="M730 250 h30" stroke="#2b2b2b" stroke-width="10" stroke-linecap="round"/>
  <rect x="390" y="470" width="420" height="120" rx="14" fill="#f6f3ec" opacity="0.85"/>
  <rect x="420" y="505" width="200" height="20" rx="6" fill="${p.accent}"/>
  <rect x="420" y="545" width="300" height="16" rx="6" fill="${p.dark}" opacity="0.4"/>`;

function solarPanel(p: Palette, slug: string): string {
  const panels = /120/.test(slug) ? 4 : /28/.test(slug) ? 2 : 3;
  const pw = 700 / panels;
  const cells = (x: number) =>
    Array.from({ length: 12 }, (_, i) => {
      const cx = x + 16 + (i % 3) * ((pw - 32) / 3);
      const cy = 300 + Math.floor(i / 3) * 85;
      return `<rect x="${cx + 3}" y="${cy + 3}" width="${(pw - 32) / 3 - 6}" height="79" fill="#2d4a6b" stroke="#8fb0d0" stroke-width="2"/>`;
    }).join('');
  return `<circle cx="1030" cy="150" r="70" fill="#ffd866"/>
  ${Array.from({ length: panels }, (_, i) => {
    const x = 250 + i * pw;
    return `<rect x="${x}" y="280" width="${pw - 8}" height="380" rx="10" fill="${p.dark}"/>${cells(x)}`;
  }).join('')}
  <path d="M600 660 C 600 720 700 740 760 720" fill="none" stroke="${p.dark}" stroke-width="10"/>
  <rect x="750" y="705" width="60" height="32" rx="8" fill="${p.accent}"/>`;
}

const radio = (p: Palette) => `
  <rect x="640" y="120" width="34" height="200" rx="14" fill="${p.dark}"/>
  <rect x="470" y="300" width="260" height="420" rx="40" fill="${p.body}" stroke="${p.dark}" stroke-width="10"/>
  <rect x="505" y="340" width="190" height="100" rx="12" fill="#c9e4c5" stroke="${p.dark}" stroke-width="6"/>
  <path d="M525 395 h40 l10 -20 l14 40 l12 -30 l10 10 h80" fill="none" stroke="${p.dark}" stroke-width="5"/>
  ${Array.from({ length: 9 }, (_, i) => `<rect x="${515 + (i % 3) * 60}" y="${470 + Math.floor(i / 3) * 60}" width="48" height="44" rx="10" fill="${p.dark}" opacity="0.75"/>`).join('')}
  <circle cx="520" cy="300" r="22" fill="${p.accent}" stroke="${p.dark}" stroke-width="6"/>`;

const cable = (p: Palette) => `
  <path d="M260 560 C 380 300 560 700 700 440 S 900 320 960 420" fill="none" stroke="${p.dark}" stroke-width="22" stroke-linecap="round"/>
  <rect x="190" y="540" width="120" height="70" rx="14" fill="${p.body}" stroke="${p.dark}" stroke-width="8"/>
  <rect x="150" y="560" width="45" height="30" rx="6" fill="#9aa3a0"/>
  <rect x="930" y="380" width="120" height="80" rx="16" fill="${p.accent}" stroke="${p.dark}" stroke-width="8"/>
  <rect x="1045" y="400" width="40" height="40" rx="12" fill="#9aa3a0"/>`;

const other = (p: Palette, slug: string) =>
  /fan/.test(slug)
    ? `<circle cx="600" cy="420" r="230" fill="${p.body}" stroke="${p.dark}" stroke-width="12"/>
  ${[0, 120, 240].map((a) => `<ellipse cx="600" cy="300" rx="60" ry="120" fill="#f6f3ec" opacity="0.85" transform="rotate(${a} 600 420)"/>`).join('')}
  <circle cx="600" cy="420" r="40" fill="${p.dark}"/>
  <rect x="570" y="640" width="60" height="80" fill="${p.dark}"/>`
    : `<rect x="330" y="330" width="540" height="380" rx="30" fill="${p.body}" stroke="${p.dark}" stroke-width="10"/>
  <rect x="310" y="290" width="580" height="80" rx="22" fill="${p.accent}" stroke="${p.dark}" stroke-width="10"/>
  <path d="M480 290 Q600 200 720 290" fill="none" stroke="${p.dark}" stroke-width="16" stroke-linecap="round"/>
  <rect x="560" y="420" width="80" height="40" rx="8" fill="#c9e4c5" stroke="${p.dark}" stroke-width="5"/>`;

const SUBJECT: Record<string, string> = {
  lantern: 'a lantern with a glowing globe and a carry handle',
  headlamp: 'a headlamp on its strap, casting a beam',
  'hand-torch': 'a hand torch casting a beam',
  'power-bank': 'a power bank with charge lights and ports',
  'battery-12v': 'a 12 V battery box with red and black terminals',
  'solar-panel': 'a folding solar panel under the sun',
  radio: 'a handheld radio with an antenna, screen and keypad',
  'cable-adapter': 'a cable with a connector at each end',
  fan: 'a small tent fan',
  other: 'a camp cool box with a handle',
};

function drawing(item: DemoGearItem): { svg: string; subject: string } {
  const p = paletteFor(item.slug);
  const key = item.category === 'light' ? (item.kind ?? 'lantern') : item.category === 'other' && /fan/.test(item.slug) ? 'fan' : item.category;
  const content =
    key === 'lantern' ? lantern(p)
    : key === 'headlamp' ? headlamp(p)
    : key === 'hand-torch' ? torch(p)
    : key === 'power-bank' ? powerBank(p)
    : key === 'battery-12v' ? battery12v(p)
    : key === 'solar-panel' ? solarPanel(p, item.slug)
    : key === 'radio' ? radio(p)
    : key === 'cable-adapter' ? cable(p)
    : other(p, item.slug);
  return { svg: frame(p, content), subject: SUBJECT[key] ?? SUBJECT.other! };
}

export const demoPhotoId = (slug: string) => `demo-photo-${slug}`;

/** Draws and stores one picture per approved demo item; returns how many photo rows it inserted. */
export async function seedDemoPhotos(db: Db, uploadsDir: string): Promise<number> {
  const todo = DEMO_GEAR.filter((item) => item.status === 'approved');
  let inserted = 0;
  // Four at a time: sharp works on libuv's thread pool (4 threads by default).
  for (let start = 0; start < todo.length; start += 4) {
    const counts = await Promise.all(todo.slice(start, start + 4).map((item) => seedOne(db, uploadsDir, item)));
    inserted += counts.reduce((a, b) => a + b, 0);
  }
  return inserted;
}

async function seedOne(db: Db, uploadsDir: string, item: DemoGearItem): Promise<number> {
  const row = db.select({ id: gearItems.id, ownerId: gearItems.ownerId }).from(gearItems).where(eq(gearItems.id, item.id)).get();
  if (!row) return 0;
  const existing = db.select({ id: photos.id, storageKey: photos.storageKey }).from(photos).where(eq(photos.gearItemId, item.id)).get();
  const ours = existing?.id === demoPhotoId(item.slug);
  if (existing && !ours) return 0; // the item already has someone's photos
  if (existing && STORED_WIDTHS.every((w) => existsSync(variantPath(uploadsDir, existing.storageKey, w)))) return 0;
  const { svg, subject } = drawing(item);
  // Deterministic: the same drawing gives the same storage key, so this only rewrites missing files.
  const stored = await processAndStorePhoto(await renderTrustedSvg(svg), { uploadsDir, salt: item.id });
  if (ours) return 0;
  return db
    .insert(photos)
    .values({
      id: demoPhotoId(item.slug),
      ownerId: row.ownerId,
      gearItemId: item.id,
      ...stored,
      altText: `Drawing of ${subject} (an illustration standing in for a photo of the ${item.name})`,
      position: 0,
    })
    .onConflictDoNothing()
    .run().changes;
}

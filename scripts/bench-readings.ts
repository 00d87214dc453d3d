/*
 * Bench (not a test): parse, analyse and encode a generated 100 000-row logger CSV.
 * Run: npx tsx scripts/bench-readings.ts [rows]
 * Prints parse time, energy computation time, encode size (vs raw float64 and base64) and peak memory.
 */
import { bytesToBase64, decodeSeries, encodeSeries, parseReadings } from '../lib/readings';
import { analyzeTrial } from '../lib/field-tests/analysis';

const rows = Number(process.argv[2] ?? 100_000);
let peakRss = 0;
let peakHeap = 0;
const sample = () => {
  const m = process.memoryUsage();
  peakRss = Math.max(peakRss, m.rss);
  peakHeap = Math.max(peakHeap, m.heapUsed);
};
const mb = (b: number) => `${(b / 1e6).toFixed(2)} MB`;

// An invented bank discharge: V falls slowly with a little ripple, A steady, logged every second.
const lines = ['elapsed_s,volts_V,current_mA'];
for (let i = 0; i < rows; i++) {
  const v = 5.1 - (0.2 * i) / rows + ((i * 7919) % 11) / 1000;
  lines.push(`${i},${v.toFixed(3)},${1950 + ((i * 104729) % 21)}`);
}
const text = lines.join('\n');
const bytes = new TextEncoder().encode(text);
sample();
console.log(`rows ${rows}, file ${mb(bytes.length)}`);

let ticks = 0;
let t0 = performance.now();
const r = parseReadings(bytes, { onProgress: () => { ticks++; sample(); } });
const parseMs = performance.now() - t0;
sample();
if (!r.ok) throw new Error(r.error.message);
console.log(`parse (decode, validate, build series): ${parseMs.toFixed(0)} ms, ${ticks} progress callbacks`);

t0 = performance.now();
const a = analyzeTrial('energy-delivered', { itemId: 'bench', samples: r.samples });
console.log(`energyWh over every row: ${(performance.now() - t0).toFixed(0)} ms → ${a.ok ? a.figures[0]!.value.toFixed(3) : a.error.message} Wh`);

t0 = performance.now();
const encoded = encodeSeries(r.samples);
const encMs = performance.now() - t0;
t0 = performance.now();
const decoded = decodeSeries(encoded);
const decMs = performance.now() - t0;
sample();
if (!decoded.ok) throw new Error(decoded.error);
const raw = rows * 8 * (1 + r.meta.fields.length);
console.log(`encode ${encMs.toFixed(0)} ms, decode ${decMs.toFixed(0)} ms`);
console.log(`encoded ${mb(encoded.length)} (${(encoded.length / rows).toFixed(2)} bytes/row) vs raw float64 ${mb(raw)}; base64 ${mb(bytesToBase64(encoded).length)}`);
console.log(`peak memory: rss ${mb(peakRss)}, heap used ${mb(peakHeap)}`);

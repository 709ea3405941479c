import { seededRandom } from './timing';

/** Invented scenario: a city bus company's breakdown log, one line per breakdown. */
const DEPOTS = ['Eastgate', 'Riverside', 'Hilltop', 'Millbrook', '"Quay St, North"', '"Quay St, South"', 'Kiln Yard'];
const ENGINE_TYPES = ['diesel', 'hybrid', 'electric', 'biogas', 'hydrogen'];
/** Per depot, the chance of each engine type (older depots run more diesels), so the table has structure. */
const ENGINE_MIX = [
  [0.55, 0.25, 0.1, 0.07, 0.03],
  [0.3, 0.3, 0.3, 0.05, 0.05],
  [0.6, 0.2, 0.05, 0.1, 0.05],
  [0.2, 0.2, 0.5, 0.05, 0.05],
  [0.4, 0.3, 0.2, 0.05, 0.05],
  [0.35, 0.25, 0.25, 0.1, 0.05],
  [0.7, 0.1, 0.05, 0.1, 0.05],
];
const SHIFTS = ['early', 'day', 'late', 'night'];
const WEEKDAYS = ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'];
/** Rare notes exercise quoting: delimiters, doubled quotes and a line break inside quotes. */
const NOTES = ['brakes', '"door, rear"', '"driver said ""grinding"""', '"coolant leak\nseen twice"', 'heater'];
const NOTE_SHARE = 0.04;
const LINES_PER_BLOCK = 4096;

function pickWeighted(weights: readonly number[], u: number): number {
  let cumulative = 0;
  for (let i = 0; i < weights.length - 1; i++) {
    cumulative += weights[i];
    if (u < cumulative) return i;
  }
  return weights.length - 1;
}

/**
 * A repeatable raw-data CSV of bus breakdowns (`depot,engine_type,shift,weekday,odometer_km,note`), about
 * 34 bytes a row, with LF line ends and some quoted fields holding commas, doubled quotes and line breaks.
 *
 * @param rows - Data rows below the header.
 * @param seed - Seed of the mulberry32 generator; the same seed gives the same text.
 * @returns The CSV text, ending with a line break.
 */
export function generateRawCsv(rows: number, seed: number): string {
  const random = seededRandom(seed);
  const blocks: string[] = ['depot,engine_type,shift,weekday,odometer_km,note'];
  let lines: string[] = [];
  for (let row = 0; row < rows; row++) {
    const depot = Math.floor(random() * DEPOTS.length);
    const engine = ENGINE_TYPES[pickWeighted(ENGINE_MIX[depot], random())];
    const shift = SHIFTS[Math.floor(random() * SHIFTS.length)];
    const weekday = WEEKDAYS[Math.floor(random() * WEEKDAYS.length)];
    const odometer = 10_000 + Math.floor(random() * 890_000);
    const note = random() < NOTE_SHARE ? NOTES[Math.floor(random() * NOTES.length)] : '';
    lines.push(`${DEPOTS[depot]},${engine},${shift},${weekday},${odometer},${note}`);
    // Joining in blocks keeps the generator's peak memory near the size of the text itself.
    if (lines.length === LINES_PER_BLOCK) {
      blocks.push(lines.join('\n'));
      lines = [];
    }
  }
  if (lines.length > 0) blocks.push(lines.join('\n'));
  return blocks.join('\n') + '\n';
}

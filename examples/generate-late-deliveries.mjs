// Generates bakery-late-deliveries.csv: an invented log of one bakery's van deliveries, one row per delivery,
// with the shift as a stratum column. Deterministic (a fixed-seed mulberry32 generator), so the committed file
// can be checked against a fresh run: `node examples/generate-late-deliveries.mjs > examples/bakery-late-deliveries.csv`.
//
// The invented pattern: late deliveries are more common at night, and the red van drives most night rounds,
// so the unstratified table overstates how much worse the red van is; within each shift the gap is smaller.

const SEED = 20261202;
const ROWS = 204;

/** mulberry32 (Tommy Ettinger, public domain): a small seeded generator, enough for invented example data. */
function mulberry32(seed) {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const SHIFTS = [
  { name: 'early', share: 0.4, redVan: 0.3, late: { 'Blue van': 0.08, 'Red van': 0.12 } },
  { name: 'midday', share: 0.3, redVan: 0.5, late: { 'Blue van': 0.15, 'Red van': 0.2 } },
  { name: 'night', share: 0.3, redVan: 0.8, late: { 'Blue van': 0.3, 'Red van': 0.38 } },
];
const STOPS = ['Mill Lane café', 'Station kiosk', 'Harbour deli', 'School canteen', 'Market hall', 'Care home kitchen'];

const random = mulberry32(SEED);
const lines = ['date,shift,van,stop,crates,arrival'];
for (let k = 0; k < ROWS; k++) {
  const day = 1 + Math.floor(k / 7);
  const date = `2026-03-${String(Math.min(day, 31)).padStart(2, '0')}`;
  let pick = random();
  const shift = SHIFTS.find((candidate) => (pick -= candidate.share) < 0) ?? SHIFTS[SHIFTS.length - 1];
  const van = random() < shift.redVan ? 'Red van' : 'Blue van';
  const stop = STOPS[Math.floor(random() * STOPS.length)];
  const crates = 1 + Math.floor(random() * 6);
  const arrival = random() < shift.late[van] ? 'late' : 'on time';
  lines.push([date, shift.name, van, stop, crates, arrival].join(','));
}
process.stdout.write(lines.join('\n') + '\n');

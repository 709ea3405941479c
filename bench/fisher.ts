import { conditionalOddsRatio } from '../src/core/exact/conditionalOddsRatio';
import { fisherExact2x2 } from '../src/core/exact/fisherExact2x2';
import { medianMs, seededRandom, type Figure } from './timing';

type Table = [[number, number], [number, number]];

/** Near-balanced margins with a small association: the longest tail walks (the mode sits in the middle). */
function balancedTable(total: number, seed: number): Table {
  const random = seededRandom(seed);
  const quarter = Math.floor(total / 4);
  const jitter = () => Math.floor((random() - 0.5) * Math.sqrt(quarter));
  const a = quarter + jitter();
  const b = quarter + jitter();
  const c = quarter + jitter();
  return [[a, b], [c, total - a - b - c]];
}

/** Random tables with N below `maxTotal`, cycled through so no single table's cost dominates. */
function randomTables(count: number, maxTotal: number, seed: number): Table[] {
  const random = seededRandom(seed);
  return Array.from({ length: count }, () => {
    const cells = Array.from({ length: 4 }, () => random());
    const sum = cells.reduce((s, v) => s + v, 0);
    const [a, b, c, d] = cells.map((v) => Math.floor((v / sum) * maxTotal * random()));
    return [[a, b], [c, d]] as Table;
  });
}

export function benchFisher(): Figure[] {
  const figures: Figure[] = [];
  const pOnly = { oddsRatio: false } as const;
  const smallTables = randomTables(64, 10_000, 11);
  let next = 0;
  figures.push({
    name: 'Fisher 2×2 p-values, random tables N ≤ 10^4',
    value: medianMs(() => fisherExact2x2(smallTables[next++ % smallTables.length], pOnly)),
    unit: 'ms',
    target: { value: 0.1, better: 'lower' },
  });
  for (const [label, total, target] of [['10^4', 1e4, 0.1], ['10^6', 1e6, 5], ['10^7', 1e7, 5]] as const) {
    const table = balancedTable(total, 7);
    figures.push({
      name: `Fisher 2×2 p-values, balanced margins N = ${label}`,
      value: medianMs(() => fisherExact2x2(table, pOnly)),
      unit: 'ms',
      target: { value: target, better: 'lower' },
    });
  }
  for (const [label, total] of [['10^4', 1e4], ['10^7', 1e7]] as const) {
    const table = balancedTable(total, 7);
    figures.push({
      name: `conditional odds ratio + 95% exact interval, balanced N = ${label}`,
      value: medianMs(() => conditionalOddsRatio(table, 0.95)),
      unit: 'ms',
    });
  }
  return figures;
}

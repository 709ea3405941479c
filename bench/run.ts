/**
 * `npm run bench`: prints each figure beside its target and the ratio to it. Never asserts:
 * these machines are shared and noisy, so targets are read by people, not enforced by tests.
 */
import { benchAnalysis } from './analysis';
import { benchCrossTabulate } from './crossTabulate';
import { benchDesigns } from './designs';
import { benchExactMultinomial } from './exactMultinomial';
import { benchExtension } from './extension';
import { benchFisher } from './fisher';
import { benchMonteCarlo } from './monteCarlo';
import { benchNetworkExact } from './networkExact';
import { benchPlan } from './plan';
import { benchSpecial } from './special';
import type { Figure } from './timing';

function show(figure: Figure): string {
  const value = figure.value >= 100 ? figure.value.toFixed(0) : figure.value >= 1 ? figure.value.toFixed(2) : figure.value.toPrecision(3);
  let verdict = '';
  if (figure.target) {
    const ratio = figure.target.better === 'lower' ? figure.value / figure.target.value : figure.target.value / figure.value;
    const meets = ratio <= 1;
    verdict = `target ${figure.target.better === 'lower' ? '<' : '≥'} ${figure.target.value} ${figure.unit}  ratio ${ratio.toFixed(2)} ${meets ? 'meets' : 'MISSES'}`;
  }
  return `${figure.name.padEnd(64)} ${value.padStart(10)} ${figure.unit.padEnd(8)} ${verdict}`;
}

async function main(): Promise<void> {
  const groups: [string, () => Figure[] | Promise<Figure[]>][] = [
    ['Special functions', benchSpecial],
    ['Analysis and table finding', benchAnalysis],
    ['Streaming cross-tabulation (1,000,000 rows)', benchCrossTabulate],
    ["Fisher's exact test, 2×2", benchFisher],
    ['Freeman–Halton exact test, r×c (worst of several tables per size)', benchNetworkExact],
    ['Monte Carlo p-values: one thread, and the worker pool', benchMonteCarlo],
    ['Exact multinomial goodness of fit', benchExactMultinomial],
    ['Study planning', benchPlan],
    ['Designs: strata, exact stratified test, pairwise comparisons', benchDesigns],
    ['Extension: bundle sizes, activation, table to panel view', benchExtension],
  ];
  const only = process.argv.slice(2);
  console.log(`Node ${process.version}, ${new Date().toISOString()}`);
  for (const [title, run] of groups.filter(([title]) => only.length === 0 || only.some((word) => title.toLowerCase().includes(word.toLowerCase())))) {
    console.log(`\n${title}`);
    for (const figure of await run()) console.log(show(figure));
  }
}

main().catch((error: unknown) => {
  console.error(error);
  process.exitCode = 1;
});

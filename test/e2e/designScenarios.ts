import assert from 'node:assert/strict';
import type { Locator } from 'playwright-core';
import { cliJson, cliSection, fixed, type CliSection } from './cliReference';
import type { UiScenario } from './scenarios';
import { STEP_MS, type Workbench } from './workbench';

// Issue 7: each design works from the extension on the bundled invented examples. Every scenario
// answers the design questions as a person would, then checks the panel's design section line by line
// (and its table cell by cell) against the CLI's report of the same file and options, and the headline
// numbers against the CLI's JSON. The examples' counts are invented; the statistics themselves are
// checked against outside references in the unit tests (test/core/designs/).

const CHECK_TABLE = 'Tallywise: Check the count table here';
const CHECK_TABLE_AS = 'Tallywise: Check the count table as paired, stratified or ordered';
const HOW_COLLECTED = 'how were these counts collected?';

interface ReferenceJson {
  n: number;
  table: { rowLabels: string[]; columnLabels: string[]; observed: number[][] };
  paired: null | { n: number; discordant: { b: number; c: number } };
  stratified: null | {
    strata: { label: string; n: number }[];
    cmh: { value: number };
    pooledOddsRatio: { estimate: number } | null;
  };
  followUps: null | {
    pairwise?: { comparisons: { firstLabel: string; secondLabel: string; differs: boolean }[] };
    trend?: { z: number; orderedAlong: string; outcomeLabel: string };
  };
}

/** The marked cells carry a visually hidden word for screen readers; the CLI prints the bare value. */
const bare = (text: string) => text.replace(/\s*\(marked\)$/, '').trim();

/** The panel's section[data-design=id]: same title, same lines and same table as the CLI's block. */
async function expectDesignSection(workbench: Workbench, id: string, reference: CliSection): Promise<Locator> {
  const section = workbench.panel().locator(`section[data-design="${id}"]`);
  await workbench.visible(section, `the panel's "${reference.title}" section (data-design="${id}")`);
  assert.equal((await section.locator('h2').textContent())?.trim(), reference.title, `the ${id} section's heading`);
  assert.deepEqual(await section.locator('ul.design-lines li').allTextContents(), reference.lines, `the ${id} section's lines against the CLI`);
  const table = section.locator('table.design-table');
  if (!reference.table) {
    assert.equal(await table.count(), 0, `the CLI prints no table under "${reference.title}"`);
    return section;
  }
  assert.deepEqual((await table.locator('thead th').allTextContents()).map(bare), reference.table.header, `the ${id} table's header against the CLI`);
  const rows = table.locator('tbody tr');
  assert.equal(await rows.count(), reference.table.rows.length, `the ${id} table's row count against the CLI`);
  for (let r = 0; r < reference.table.rows.length; r++) {
    const shown = (await rows.nth(r).locator('th, td').allTextContents()).map(bare);
    assert.deepEqual(shown, reference.table.rows[r], `row ${r + 1} of the ${id} table against the CLI`);
  }
  return section;
}

async function summaryText(workbench: Workbench, startsWith: string): Promise<string> {
  const text = (await (await workbench.panelSummary(startsWith)).textContent()) ?? '';
  assert.ok(text.startsWith(startsWith), `the summary should start with "${startsWith}", got "${text}"`);
  return text;
}

/** Asserts that no quick pick or input box is open (the command asked nothing). */
async function noQuestion(workbench: Workbench): Promise<void> {
  assert.equal(await workbench.page.locator('.quick-input-widget:visible').count(), 0, 'no quick pick or input box should be open');
}

export const DESIGN_SCENARIOS: UiScenario[] = [
  {
    name: 'design-paired',
    files: ['climbing-gym-checks.md'],
    async run({ workbench, screenshot }) {
      // Table 1 (lines 7–10): the same members at induction (rows) and refresher (columns).
      const args = ['--line', '9', '--design', 'paired'];
      const reference = cliJson<ReferenceJson>('climbing-gym-checks.md', args);
      const block = cliSection('climbing-gym-checks.md', args, 'Paired answers (McNemar)', false);
      assert.ok(reference.paired, 'the CLI treats table 1 as paired');
      const { b, c } = reference.paired.discordant;
      // The discordant pairs are the table's off-diagonal cells as written in the note.
      assert.deepEqual([b, c], [reference.table.observed[0][1], reference.table.observed[1][0]]);

      const editor = await workbench.open('climbing-gym-checks.md');
      await workbench.goToLine(editor, 9);
      await workbench.runCommand(CHECK_TABLE_AS);
      await workbench.answer(HOW_COLLECTED, 'The same units measured twice (paired 2×2)');
      const summary = await summaryText(workbench, 'Paired 2×2:');
      assert.ok(summary.includes(`(${b} and ${c} discordant pairs)`), `the summary names ${b} and ${c} discordant pairs: "${summary}"`);
      const section = await expectDesignSection(workbench, 'paired', block);
      const [first, second] = reference.table.rowLabels;
      const [firstAfter, secondAfter] = reference.table.columnLabels;
      await workbench.visible(section.locator('li', { hasText: `Discordant pairs: ${b} ${first} → ${secondAfter}, ${c} ${second} → ${firstAfter}` }), `the discordant pairs ${b} and ${c}`);
      await section.scrollIntoViewIfNeeded();
      await screenshot('design-paired');
    },
  },
  {
    name: 'design-strata',
    files: ['ferry-seasickness.md'],
    async run({ workbench, screenshot }) {
      // Three consecutive 2×2 tables with the same labels, one per ferry route; the cursor is in the first.
      const args = ['--line', '11', '--design', 'stratified'];
      const reference = cliJson<ReferenceJson>('ferry-seasickness.md', args);
      assert.ok(reference.stratified, 'the CLI reads the three tables as strata');
      const { strata, cmh, pooledOddsRatio } = reference.stratified;
      assert.equal(strata.length, 3, 'one stratum per ferry route in the note');
      const block = cliSection('ferry-seasickness.md', args, `Strata (${strata.length}, Cochran–Mantel–Haenszel)`, true);

      const editor = await workbench.open('ferry-seasickness.md');
      await workbench.goToLine(editor, 11);
      await workbench.runCommand(CHECK_TABLE_AS);
      await workbench.answer(HOW_COLLECTED, 'The same 2×2 comparison in several strata');
      const summary = await summaryText(workbench, 'Stratified 2×2:');
      assert.match(summary, /^Stratified 2×2: CMH χ²\(1/, 'the summary leads with the CMH test');
      assert.ok(summary.includes(`= ${fixed(cmh.value)}`), `the summary shows CMH χ² = ${fixed(cmh.value)}: "${summary}"`);
      if (pooledOddsRatio) assert.ok(summary.includes(`common odds ratio ${fixed(pooledOddsRatio.estimate)}`), `the summary shows the common odds ratio: "${summary}"`);
      const section = await expectDesignSection(workbench, 'strata', block);
      const labels = await section.locator('table.design-table tbody th[scope="row"]').allTextContents();
      assert.deepEqual(labels, strata.map((stratum) => stratum.label), 'the three routes as stratum rows');
      await section.scrollIntoViewIfNeeded();
      await screenshot('design-strata');
    },
  },
  {
    name: 'design-strata-csv',
    files: ['bakery-late-deliveries.csv'],
    async run({ workbench, screenshot }) {
      // Raw rows (one delivery each): van × arrival, in strata by the shift column.
      const args = ['--columns', 'van,arrival', '--stratum', 'shift', '--design', 'stratified'];
      const reference = cliJson<ReferenceJson>('bakery-late-deliveries.csv', args);
      assert.ok(reference.stratified, 'the CLI splits the cross-tabulation by shift');
      const { strata, cmh } = reference.stratified;
      const block = cliSection('bakery-late-deliveries.csv', args, `Strata (${strata.length}, Cochran–Mantel–Haenszel)`, true);

      await workbench.open('bakery-late-deliveries.csv');
      await workbench.runCommand(CHECK_TABLE_AS);
      await workbench.answer(HOW_COLLECTED, 'The same 2×2 comparison in several strata');
      await workbench.answer('one row per observation', 'van × arrival');
      await workbench.answer('strata', 'shift');
      const summary = await summaryText(workbench, 'Stratified 2×2:');
      assert.ok(summary.includes(`CMH χ²(1, N = ${reference.n}) = ${fixed(cmh.value)}`), `the summary shows CMH χ²(1, N = ${reference.n}) = ${fixed(cmh.value)}: "${summary}"`);
      const section = await expectDesignSection(workbench, 'strata', block);
      const labels = await section.locator('table.design-table tbody th[scope="row"]').allTextContents();
      assert.deepEqual(labels, strata.map((stratum) => stratum.label), 'one stratum row per shift');
      await section.scrollIntoViewIfNeeded();
      await screenshot('design-strata-csv');
    },
  },
  {
    name: 'design-ordered',
    files: ['climbing-gym-checks.md'],
    async run({ workbench, screenshot }) {
      // Table 2 (lines 14–17): worn lanyards by months in service, 0-3 … 13+ (ordered columns).
      const args = ['--line', '16', '--ordered', 'columns'];
      const reference = cliJson<ReferenceJson>('climbing-gym-checks.md', args);
      const trend = reference.followUps?.trend;
      assert.ok(trend, 'the CLI runs the trend test on the ordered columns');
      const block = cliSection('climbing-gym-checks.md', args, 'Ordered categories', false);

      const editor = await workbench.open('climbing-gym-checks.md');
      await workbench.goToLine(editor, 16);
      await workbench.runCommand(CHECK_TABLE_AS);
      await workbench.answer(HOW_COLLECTED, 'Ordered categories');
      await workbench.answer('which categories have an order?', 'The columns are ordered');
      await workbench.type('scores for the ordered columns', '');
      await summaryText(workbench, 'Test of independence (2×5):');
      const section = await expectDesignSection(workbench, 'ordered', block);
      await workbench.visible(section.locator('li', { hasText: `Cochran–Armitage trend in the share of "${trend.outcomeLabel}" across columns` }), 'the Cochran–Armitage line');
      await workbench.visible(section.locator('li', { hasText: `(equally spaced): Z = ${fixed(trend.z)}` }), `Z = ${fixed(trend.z)} with equally spaced scores`);
      await section.scrollIntoViewIfNeeded();
      await screenshot('design-ordered');
    },
  },
  {
    name: 'design-pairwise',
    files: ['ski-school-notes.md'],
    async run({ workbench, screenshot }) {
      // Table 1: four instructors × three outcomes; the plain command adds the pairwise follow-up by itself.
      const args = ['--line', '8'];
      const reference = cliJson<ReferenceJson>('ski-school-notes.md', args);
      const comparisons = reference.followUps?.pairwise?.comparisons;
      assert.ok(comparisons, 'the CLI compares the instructors two at a time');
      assert.equal(comparisons.length, (reference.table.rowLabels.length * (reference.table.rowLabels.length - 1)) / 2, 'every pair of rows');
      const block = cliSection('ski-school-notes.md', args, 'Which groups differ', true);

      const editor = await workbench.open('ski-school-notes.md');
      await workbench.goToLine(editor, 8);
      await workbench.runCommand(CHECK_TABLE);
      await summaryText(workbench, 'Test of independence (4×3):');
      await noQuestion(workbench);
      const section = await expectDesignSection(workbench, 'pairwise', block);
      const differs = await section.locator('table.design-table tbody tr').evaluateAll((rows) => rows.map((row) => row.lastElementChild?.textContent ?? ''));
      assert.deepEqual(differs.map(bare), comparisons.map((pair) => (pair.differs ? 'yes' : 'no')), 'which pairs differ, against the CLI JSON');
      await section.scrollIntoViewIfNeeded({ timeout: STEP_MS });
      await screenshot('design-pairwise');
    },
  },
];

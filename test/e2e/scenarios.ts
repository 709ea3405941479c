import assert from 'node:assert/strict';
import * as fs from 'node:fs';
import * as path from 'node:path';
import type { Page } from 'playwright-core';
import { DESIGN_SCENARIOS } from './designScenarios';
import { waitUntil } from './host';
import { PLAN_SCENARIOS } from './planScenarios';
import { STEP_MS, Workbench } from './workbench';

// The UI scenarios: what a person does in the workbench, checked on screen and on disk.

const CHECK_TABLE = 'Tallywise: Check the count table here';

export interface UiContext {
  page: Page;
  workbench: Workbench;
  workspace: string;
  /** Saves a screenshot of the page as test-artifacts/e2e-<name>.png and returns its file name. */
  screenshot(name: string): Promise<string>;
}

export interface UiScenario {
  name: string;
  /** Example files copied into the scenario's fresh workspace; the first is awaited in the explorer. */
  files: string[];
  run(context: UiContext): Promise<void>;
}

export const UI_SCENARIOS: UiScenario[] = [
  {
    name: 'palette-insert',
    files: ['ski-school-notes.md'],
    async run({ workbench, workspace, screenshot }) {
      const file = path.join(workspace, 'ski-school-notes.md');
      const original = fs.readFileSync(file, 'utf8');
      const editor = await workbench.open('ski-school-notes.md');
      await workbench.goToLine(editor, 8);
      await workbench.runCommand(CHECK_TABLE);
      await workbench.panelSummary('χ²(6, N = 412)');
      const panel = workbench.panel();
      await workbench.visible(panel.locator('table.observed td', { hasText: /^88$/ }).first(), 'the observed count 88 (Anouk × Completed) in the panel');
      await screenshot('palette-insert');
      await panel.getByRole('button', { name: 'Insert below the table', exact: true }).click();
      await workbench.save('ski-school-notes.md', editor);
      await waitUntil(() => fs.readFileSync(file, 'utf8') !== original, 'ski-school-notes.md to change on disk', STEP_MS);
      const before = original.split('\n');
      const after = fs.readFileSync(file, 'utf8').split('\n');
      const added = after.length - before.length;
      assert.ok(added >= 2, `expected a blank line and a paragraph, got ${added} new lines`);
      // The table ends on line 12: everything up to it and everything after the insertion is unchanged.
      assert.deepEqual(after.slice(0, 12), before.slice(0, 12));
      assert.deepEqual(after.slice(12 + added), before.slice(12));
      const inserted = after.slice(12, 12 + added);
      assert.equal(inserted[0], '', 'a blank line separates the table from the paragraph');
      assert.match(inserted.slice(1).join('\n'), /^We tested whether .*\*N\* = 412/s, 'the write-up paragraph follows the table');
    },
  },
  {
    name: 'codelens',
    files: ['ski-school-notes.md'],
    async run({ page, workbench, screenshot }) {
      await workbench.open('ski-school-notes.md');
      const lenses = page.locator('.codelens-decoration a', { hasText: 'Test this table' });
      await waitUntil(async () => (await lenses.count()) === 3, 'three "Test this table" CodeLenses (one per table)', STEP_MS);
      await lenses.nth(1).click();
      await workbench.panelSummary('χ²(1, N = 230)');
      await workbench.visible(workbench.panel().locator('table.observed td', { hasText: /^41$/ }).first(), 'the observed count 41 (Own helmet × Fell) in the panel');
      await screenshot('codelens');
    },
  },
  {
    name: 'csv-columns',
    files: ['bus-depot-breakdowns.csv'],
    async run({ workbench, screenshot }) {
      await workbench.open('bus-depot-breakdowns.csv');
      await workbench.runCommand(CHECK_TABLE);
      await workbench.pick('depot × cause');
      await workbench.panelSummary('χ²(8, N = 480)');
      await workbench.visible(workbench.panel().locator('table.observed th', { hasText: 'Eastgate' }).first(), 'the depot Eastgate as a row of the cross-tabulation');
      await screenshot('csv-columns');
    },
  },
  {
    name: 'greenhouse-merge',
    files: ['greenhouse-blooms.md'],
    async run({ workbench, screenshot }) {
      const editor = await workbench.open('greenhouse-blooms.md');
      await workbench.goToLine(editor, 7);
      await workbench.runCommand(CHECK_TABLE);
      await workbench.panelSummary('χ²(6, N = 50)');
      const panel = workbench.panel();
      await workbench.visible(panel.locator('p', { hasText: 'Merge columns: Bud + Open + Full' }).first(), 'the merge proposal');
      await screenshot('greenhouse-proposal');
      await panel.getByRole('button', { name: 'Apply the proposed merge', exact: true }).click();
      // Bud, Open and Full become one column: a 3×2 table, df = 2.
      await workbench.panelSummary('χ²(2, N = 50)');
      await workbench.visible(panel.locator('table.observed th', { hasText: 'Bud + Open + Full' }).first(), 'the merged column in the observed table');
      await screenshot('greenhouse-merged');
    },
  },
  {
    name: 'no-table',
    files: ['ski-school-notes.md'],
    async run({ workbench, screenshot }) {
      const editor = await workbench.open('ski-school-notes.md');
      await workbench.goToLine(editor, 1);
      await workbench.runCommand(CHECK_TABLE);
      await workbench.notification('line 1 is not inside a table');
      await screenshot('no-table');
    },
  },
  ...DESIGN_SCENARIOS,
  ...PLAN_SCENARIOS,
];

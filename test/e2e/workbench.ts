import type { FrameLocator, Locator, Page } from 'playwright-core';

// Driving code-server's workbench in Chromium: open a file, go to a line, run a palette command, read the panel.

/** Time for one workbench step (a file opening, the palette answering, a panel appearing). */
export const STEP_MS = 30_000;
/** The workbench's first load: 9–15 s measured, with margin for a busy machine. */
export const WORKBENCH_MS = 90_000;
/** Polling step while waiting for something to go away. */
const SETTLE_MS = 100;

async function visible(locator: Locator, what: string, timeout = STEP_MS): Promise<Locator> {
  try {
    await locator.waitFor({ state: 'visible', timeout });
  } catch (error) {
    throw new Error(`timed out after ${timeout} ms waiting for ${what}: ${(error as Error).message.split('\n')[0]}`, { cause: error });
  }
  return locator;
}

export class Workbench {
  constructor(readonly page: Page) {}

  async ready(firstFile: string): Promise<void> {
    await visible(this.page.locator('.monaco-workbench'), 'the workbench', WORKBENCH_MS);
    await visible(this.explorerRow(firstFile), `the explorer to list ${firstFile}`, WORKBENCH_MS);
  }

  private explorerRow(name: string): Locator {
    return this.page.locator('.explorer-folders-view .monaco-list-row', { hasText: name }).first();
  }

  editor(name: string): Locator {
    return this.page.locator(`.editor-group-container .monaco-editor[data-uri$="${name}"]`).first();
  }

  async open(name: string): Promise<Locator> {
    await (await visible(this.explorerRow(name), `explorer row ${name}`)).click();
    const editor = await visible(this.editor(name), `an editor for ${name}`);
    await visible(this.page.locator('.tabs-container .tab', { hasText: name }).first(), `the tab of ${name}`);
    await editor.locator('.view-lines').click();
    return editor;
  }

  private async palette(text: string, row?: string): Promise<void> {
    await this.page.keyboard.press('F1');
    const input = await visible(this.page.locator('.quick-input-widget .quick-input-box input'), 'the command palette');
    await input.fill(text);
    if (row) await visible(this.page.locator('.quick-input-widget .quick-input-list .monaco-list-row', { hasText: row }).first(), `palette row "${row}"`);
    await this.page.keyboard.press('Enter');
  }

  /** Moves the cursor to a 1-based line (":N" in the palette), in the focused editor. */
  async goToLine(editor: Locator, line: number): Promise<void> {
    await editor.locator('.view-lines').click();
    await this.palette(`:${line}`);
    await visible(this.page.locator('.statusbar', { hasText: `Ln ${line},` }), `the cursor on line ${line}`);
  }

  async runCommand(title: string): Promise<void> {
    await this.palette(`>${title}`, title);
  }

  /** Picks a quick-pick item by typing its label. */
  async pick(label: string): Promise<void> {
    const input = await visible(this.page.locator('.quick-input-widget .quick-input-box input'), 'the quick pick');
    await input.fill(label);
    await visible(this.page.locator('.quick-input-widget .quick-input-list .monaco-list-row', { hasText: label }).first(), `quick-pick row "${label}"`);
    await this.page.keyboard.press('Enter');
  }

  /** Waits for a quick pick or input box whose title contains `title` (a command's own question, not the palette). */
  async question(title: string): Promise<Locator> {
    await visible(this.page.locator('.quick-input-widget .quick-input-title', { hasText: title }).first(), `the question "${title}"`);
    return visible(this.page.locator('.quick-input-widget .quick-input-box input'), `the input of "${title}"`);
  }

  /** Answers a command's quick pick titled `title` by typing the item's label. */
  async answer(title: string, label: string): Promise<void> {
    await this.question(title);
    await this.pick(label);
  }

  /** Answers a command's input box titled `title` with `value` ('' accepts the default). */
  async type(title: string, value: string): Promise<void> {
    const input = await this.question(title);
    await input.fill(value);
    await this.page.keyboard.press('Enter');
  }

  /** The results panel's content frame (a webview is two nested iframes). */
  panel(): FrameLocator {
    return this.page.frameLocator('iframe.webview.ready').frameLocator('iframe#active-frame');
  }

  async panelSummary(containing: string): Promise<Locator> {
    return visible(this.panel().locator('p.summary', { hasText: containing }), `the results panel summary containing "${containing}"`);
  }

  async notification(containing: string): Promise<Locator> {
    return visible(this.page.locator('.notifications-toasts .notification-toast', { hasText: containing }).first(), `a notification containing "${containing}"`);
  }

  async save(name: string, editor: Locator): Promise<void> {
    const dirtyTab = this.page.locator('.tabs-container .tab.dirty', { hasText: name });
    await visible(dirtyTab.first(), `the tab of ${name} to show unsaved changes`);
    await editor.locator('.view-lines').click();
    await this.page.keyboard.press('Control+S');
    try {
      await dirtyTab.first().waitFor({ state: 'detached', timeout: STEP_MS });
    } catch (error) {
      throw new Error(`timed out after ${STEP_MS} ms waiting for ${name} to be saved (tab still dirty)`, { cause: error });
    }
  }

  /** Waits until no Tallywise progress notification ("Tallywise: testing …") is left on screen. */
  async progressGone(): Promise<void> {
    const progress = this.page.locator('.notifications-toasts .notification-toast', { hasText: /Tallywise: (testing|exact test|Monte Carlo)/ });
    const stopAt = Date.now() + STEP_MS;
    while ((await progress.count()) > 0) {
      if (Date.now() > stopAt) throw new Error(`timed out after ${STEP_MS} ms waiting for the Tallywise progress notification to close`);
      await this.page.waitForTimeout(SETTLE_MS);
    }
  }

  async visible(locator: Locator, what: string): Promise<Locator> {
    return visible(locator, what);
  }
}

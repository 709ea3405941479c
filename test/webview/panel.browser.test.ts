import assert from 'node:assert/strict';
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { pathToFileURL } from 'node:url';
import { buildSync } from 'esbuild';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { panelHtml } from '../../src/extension/panelHtml';
import { buildPanelView } from '../../src/extension/panelView';
import { planStudy, type PlanRequest } from '../../src/core/plan/planStudy';
import { buildPlanView, type PlanViewSource } from '../../src/extension/planPanelView';
import { isPanelToHost, type PanelToHost, type PanelView } from '../../src/protocol/messages';
import type { PlanView } from '../../src/protocol/planView';
import {
  analyzed, BAKERY_RETURNS, BUS_DEPOT_SPARSE, GREENHOUSE, HOSTILE_COLUMN, HOSTILE_ROW, SKI_SCHOOL, withHostileLabels, LAUNDRY_SHIFTS, SAILING_KNOTS, withHostileStratum,
} from '../extension/panelFixtures';

// The real panel bundle in a real headless Chromium (Debian's /usr/bin/chromium; never downloaded).
// Nothing is served over the network: the page, dist/webview.js and media/panel.css are written to a
// temporary folder and opened as file:// URLs, with cspSource `file:` so the panel's own strict CSP
// stays in force (no bypassCSP). acquireVsCodeApi is stubbed to record what the panel posts.

const root = path.resolve(__dirname, '..', '..', '..');
const CHROMIUM = '/usr/bin/chromium';
const BROWSER_TIMEOUT_MS = 60_000;
const WAIT_MS = 10_000;
const artifacts = path.join(root, 'test-artifacts');

/** Dark-theme variables as VS Code sets them on the body (values invented for the test, dark-ish). */
const DARK_THEME = `body {
  --vscode-foreground: #d4d4d4; --vscode-editor-background: #1e1e1e; --vscode-descriptionForeground: #a0a0a0;
  --vscode-button-background: #0e639c; --vscode-button-foreground: #ffffff; --vscode-button-hoverBackground: #1177bb;
  --vscode-button-secondaryBackground: #3a3d41; --vscode-button-secondaryForeground: #ffffff;
  --vscode-focusBorder: #007fd4; --vscode-panel-border: #444444; --vscode-editorWidget-background: #252526;
  --vscode-charts-red: #f14c4c; --vscode-charts-blue: #3794ff; --vscode-charts-green: #89d185;
  --vscode-charts-orange: #d18616; --vscode-charts-purple: #b180d7; --vscode-charts-yellow: #cca700;
  --vscode-editorWarning-foreground: #cca700; --vscode-font-family: sans-serif; --vscode-font-size: 13px;
}`;

/** The few browser globals the page callbacks touch (the test project has no DOM types). */
interface PageElement {
  tagName: string;
  textContent: string | null;
}
interface PageDocument {
  activeElement: PageElement | null;
  getElementById(id: string): PageElement | null;
  addEventListener(type: 'securitypolicyviolation', listener: (event: { violatedDirective: string; blockedURI: string }) => void): void;
}
interface PageWindow {
  __posted: PanelToHost[];
  __violations: string[];
  __state?: unknown;
  __restoredState?: unknown;
  acquireVsCodeApi?: () => unknown;
  postMessage(message: unknown, targetOrigin: string): void;
}
declare const window: PageWindow;
declare const document: PageDocument;
declare function getComputedStyle(element: PageElement): { outlineStyle: string; outlineWidth: string };

const VSCODE_STUB = () => {
  const w = window;
  w.__posted = [];
  w.__violations = [];
  let state: unknown;
  document.addEventListener('securitypolicyviolation', (event) => w.__violations.push(`${event.violatedDirective} ${event.blockedURI}`));
  w.acquireVsCodeApi = () => ({
    postMessage: (message: PanelToHost) => w.__posted.push(message),
    getState: () => (state !== undefined ? state : w.__restoredState),
    setState: (next: unknown) => {
      state = next;
      w.__state = next;
    },
  });
};

function ensureBundle(): string {
  const bundle = path.join(root, 'dist', 'webview.js');
  if (!fs.existsSync(bundle)) {
    buildSync({ entryPoints: [path.join(root, 'src', 'webview', 'main.ts')], outfile: bundle, bundle: true, platform: 'browser', format: 'iife', target: 'es2022', logLevel: 'warning' });
  }
  return bundle;
}

interface Fixture {
  name: string;
  view: PanelView;
}

function fixtures(): Record<'table4x3' | 'table2x2' | 'sparse' | 'fit' | 'hostile' | 'paired' | 'strata', Fixture> {
  return {
    table4x3: { name: '4x3', view: buildPanelView(analyzed(GREENHOUSE), 'greenhouse') },
    table2x2: { name: '2x2', view: buildPanelView(analyzed(SKI_SCHOOL), 'ski') },
    sparse: { name: 'sparse-merge', view: buildPanelView(analyzed(BUS_DEPOT_SPARSE, { options: { pValueMethod: 'asymptotic' } }), 'depot') },
    fit: { name: 'goodness-of-fit', view: buildPanelView(analyzed(BAKERY_RETURNS), 'bakery') },
    hostile: { name: 'hostile', view: buildPanelView(withHostileLabels(analyzed(SKI_SCHOOL)), 'hostile') },
    paired: { name: 'paired', view: buildPanelView(analyzed(SAILING_KNOTS, { options: { design: 'paired' } }), 'knots') },
    strata: { name: 'strata', view: buildPanelView(withHostileStratum(analyzed(LAUNDRY_SHIFTS, { line: 3, options: { design: 'stratified' } })), 'laundry') },
  };
}

/** A plan view as the plan command builds it (the engine's numbers, the host's strings). */
function planView(request: PlanRequest, source: PlanViewSource = {}): PlanView {
  const result = planStudy(request);
  assert.ok(result.ok, result.ok ? '' : result.issue.message);
  return buildPlanView(result.value, source);
}

describe('panel (browser)', function () {
  this.timeout(BROWSER_TIMEOUT_MS);
  let browser: Browser;
  let folder: string;
  let context: BrowserContext;
  let page: Page;
  let problems: string[];
  const views = fixtures();

  before(async () => {
    if (!fs.existsSync(CHROMIUM)) {
      throw new Error(`${CHROMIUM} is missing: the panel tests need Debian's Chromium. Install it with \`apt-get install -y chromium\` (CI does this).`);
    }
    const bundle = ensureBundle();
    folder = fs.mkdtempSync(path.join(os.tmpdir(), 'tallywise-panel-'));
    fs.copyFileSync(bundle, path.join(folder, 'webview.js'));
    fs.copyFileSync(path.join(root, 'media', 'panel.css'), path.join(folder, 'panel.css'));
    fs.writeFileSync(path.join(folder, 'theme.css'), DARK_THEME);
    fs.mkdirSync(artifacts, { recursive: true });
    browser = await chromium.launch({
      executablePath: CHROMIUM,
      headless: true,
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
      timeout: BROWSER_TIMEOUT_MS,
    });
  });

  after(async () => {
    await browser?.close();
    if (folder) fs.rmSync(folder, { recursive: true, force: true });
  });

  beforeEach(async () => {
    problems = [];
    context = await browser.newContext({ viewport: { width: 900, height: 1200 } });
    page = await context.newPage();
    page.on('dialog', (dialog) => {
      problems.push(`dialog: ${dialog.message()}`);
      void dialog.dismiss();
    });
    page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
    page.on('console', (message) => {
      if (message.type() === 'error') problems.push(`console error: ${message.text()}`);
    });
    await page.addInitScript(VSCODE_STUB);
  });

  afterEach(async () => {
    const violations = await page.evaluate(() => window.__violations).catch(() => []);
    await context.close();
    assert.deepEqual([...problems, ...violations], [], 'no dialogs, script errors or CSP violations');
  });

  /** Writes the panel page and opens it; the view is sent as the host's first message unless embedded. */
  async function open(view: PanelView, how: 'message' | 'embedded' = 'message'): Promise<void> {
    const html = panelHtml({ cspSource: 'file:', nonce: 'n0nce4test', scriptUri: 'webview.js', styleUri: 'panel.css', initialView: how === 'embedded' ? view : undefined })
      .replace('</head>', '<link rel="stylesheet" href="theme.css">\n</head>')
      .replace('<body>', '<body class="vscode-dark">');
    const file = path.join(folder, `${view.key}-${how}.html`);
    fs.writeFileSync(file, html);
    await page.goto(pathToFileURL(file).href);
    await page.waitForFunction(() => window.__posted.some((m) => m.type === 'ready'), undefined, { timeout: WAIT_MS })
      .catch(() => assert.fail('the panel never posted ready'));
    if (how === 'message') await page.evaluate((v) => window.postMessage({ type: 'show', view: v }, '*'), view);
    await page.waitForSelector('h1', { timeout: WAIT_MS }).catch(() => assert.fail('the panel never rendered its title'));
  }

  /** Opens the page and sends a plan view as the plan command does, after the page's ready. */
  async function openPlan(view: PlanView, name: string): Promise<void> {
    const html = panelHtml({ cspSource: 'file:', nonce: 'n0nce4test', scriptUri: 'webview.js', styleUri: 'panel.css' })
      .replace('</head>', '<link rel="stylesheet" href="theme.css">\n</head>')
      .replace('<body>', '<body class="vscode-dark">');
    const file = path.join(folder, `plan-${name}.html`);
    fs.writeFileSync(file, html);
    await page.goto(pathToFileURL(file).href);
    await page.waitForFunction(() => window.__posted.some((m) => m.type === 'ready'), undefined, { timeout: WAIT_MS })
      .catch(() => assert.fail('the panel never posted ready'));
    await page.evaluate((v) => window.postMessage({ type: 'showPlan', view: v }, '*'), view);
    await page.waitForSelector('h1', { timeout: WAIT_MS }).catch(() => assert.fail('the plan view never rendered its title'));
  }

  async function posted(): Promise<PanelToHost[]> {
    return page.evaluate(() => window.__posted);
  }

  async function waitForPosted(type: PanelToHost['type']): Promise<PanelToHost> {
    await page.waitForFunction((t) => window.__posted.some((m) => m.type === t), type, { timeout: WAIT_MS })
      .catch(() => assert.fail(`the panel never posted ${type}`));
    const messages = await posted();
    return messages.filter((m) => m.type === type).pop() as PanelToHost;
  }

  async function screenshot(name: string): Promise<void> {
    await page.screenshot({ path: path.join(artifacts, `panel-${name}.png`), fullPage: true });
  }

  it('shows a paired view with its McNemar section and without the independence tables', async () => {
    const { view } = views.paired;
    await open(view);
    const section = page.locator('section[data-design="paired"]');
    assert.deepEqual(await section.locator('li').allTextContents(), view.designSections![0].lines);
    assert.equal(await page.locator('table.expected').count(), 0);
    assert.equal(await page.locator('table.observed').count(), 1);
    assert.equal(await page.locator('[data-action="run-exact"]').count(), 0);
    assert.equal(await page.locator('[data-action="insert-with-expected"]').count(), 0);
    await screenshot('paired');
  });

  it('lists the strata in a table and keeps a hostile stratum name as text', async () => {
    const { view } = views.strata;
    await open(view);
    const rows = page.locator('section[data-design="strata"] table tbody tr');
    assert.equal(await rows.count(), 3);
    assert.equal(await rows.nth(1).locator('th').textContent(), HOSTILE_ROW);
    assert.equal(await page.locator('section[data-design="strata"] img').count(), 0);
    await screenshot('strata');
  });

  it('renders the 4×3 tables with captions, column and row header cells and the host\'s values', async () => {
    const { view } = views.table4x3;
    await open(view);
    assert.equal(await page.locator('h1').textContent(), view.title);
    assert.equal(await page.locator('section[aria-labelledby="tables-heading"] table caption').count(), 4);
    const observedHeaders = await page.locator('table.observed th[scope="col"]').allTextContents();
    assert.deepEqual(observedHeaders, view.tables.observed.header);
    const rowHeaders = await page.locator('table.expected th[scope="row"]').allTextContents();
    assert.deepEqual(rowHeaders, view.tables.expected.rows.map((row) => row[0]));
    assert.equal(await page.locator('table.expected tbody tr').nth(1).locator('td').nth(2).textContent(), view.tables.expected.rows[1][3]);
    assert.equal(await page.locator('.write-up').textContent(), view.writeUp);
    assert.deepEqual(await page.locator('ul.details li').allTextContents(), view.details);
    await screenshot('4x3-dark');
  });

  it('shows every residual in the heat map with its sign, a direction marker and a colour step, flagged cells bold', async () => {
    const { view } = views.table4x3;
    await open(view);
    const cells = page.locator('table.heat-map tbody td');
    const values = view.tables.residuals.values ?? [];
    const marked = new Set((view.tables.residuals.marked ?? []).map(([r, c]) => `${r},${c}`));
    assert.ok(marked.size > 0);
    for (let r = 0; r < values.length; r++) {
      for (let c = 0; c < values[r].length; c++) {
        const cell = cells.nth(r * values[r].length + c);
        const text = (await cell.textContent()) ?? '';
        const value = values[r][c];
        assert.ok(text.includes(view.tables.residuals.rows[r][c + 1]), `cell ${r},${c} shows ${text}`);
        assert.match(text, value > 0 ? /^▲ \+/ : /^▼ −/);
        assert.match((await cell.getAttribute('class')) ?? '', /\bheat-(0|pos-[1-4]|neg-[1-4])\b/);
        assert.equal(await cell.locator('strong').count(), marked.has(`${r},${c}`) ? 1 : 0, `cell ${r},${c} bold only when flagged`);
      }
    }
    const strongest = await page.locator('table.heat-map td.heat-neg-4, table.heat-map td.heat-pos-4').count();
    assert.ok(strongest >= 1, 'the |residual| ≥ 4 cells get the deepest step');
  });

  it('draws one bar and one whisker per proportion, and the toggle switches rows and columns', async () => {
    const { view } = views.table4x3;
    assert.ok(view.chart);
    await open(view);
    const chart = page.locator('[data-chart="proportions"] svg');
    assert.equal(await chart.locator('rect.bar').count(), view.chart.rowProportions.length);
    assert.equal(await chart.locator('path.whisker').count(), view.chart.rowProportions.length);
    const first = view.chart.rowProportions[0];
    assert.equal(await chart.locator('rect.bar title').first().textContent(), `${first.group}, ${first.category}: ${first.label}`);
    const toggle = page.locator('button[data-action="toggle-proportions"]');
    assert.equal(await toggle.getAttribute('aria-pressed'), 'false');
    await toggle.click();
    assert.equal(await toggle.getAttribute('aria-pressed'), 'true');
    const within = view.chart.columnProportions[0];
    assert.equal(await chart.locator('rect.bar title').first().textContent(), `${within.group}, ${within.category}: ${within.label}`);
    assert.equal(await chart.locator('rect.bar').count(), view.chart.columnProportions.length);
    await toggle.click();
    assert.equal(await toggle.getAttribute('aria-pressed'), 'false');
    const tiles = page.locator('[data-chart="mosaic"] svg rect.tile');
    assert.equal(await tiles.count(), view.chart.mosaic.reduce((a, strip) => a + strip.segments.length, 0));
  });

  it('posts the write-up choices and a standalone SVG when a chart is saved', async () => {
    await open(views.table2x2.view);
    assert.deepEqual((await posted())[0], { type: 'ready' });
    await page.click('button[data-action="insert"]');
    assert.deepEqual(await waitForPosted('insertWriteUp'), { type: 'insertWriteUp', withExpectedTable: false, withChartLink: false });
    await page.click('button[data-action="insert-with-expected"]');
    assert.deepEqual((await posted()).pop(), { type: 'insertWriteUp', withExpectedTable: true, withChartLink: false });
    await page.click('button[data-action="copy"]');
    assert.deepEqual(await waitForPosted('copyWriteUp'), { type: 'copyWriteUp' });
    for (const chart of ['proportions', 'mosaic'] as const) {
      await page.click(`button[data-action="save-${chart}"]`);
      const message = (await posted()).pop();
      assert.ok(message && message.type === 'saveChart' && message.chart === chart, JSON.stringify(message).slice(0, 200));
      assert.ok(isPanelToHost(message));
      assert.match(message.svg, /^<svg [^>]*xmlns="http:\/\/www\.w3\.org\/2000\/svg"/);
      assert.doesNotMatch(message.svg, /class="/, 'saved charts carry colours, not panel classes');
      assert.match(message.svg, /fill="rgb/);
    }
    await screenshot('2x2-dark');
  });

  it('shows the merge proposal and the exact-test buttons for a sparse table, posting applyMerge and runExact', async () => {
    const { view } = views.sparse;
    assert.ok(view.merge && view.canRunExact);
    await open(view);
    assert.equal(await page.locator('table.merged caption').textContent(), view.merge.table.caption);
    assert.equal(await page.locator('.merge-result').textContent(), view.merge.result);
    assert.equal(await page.locator('table.expected td.marked').count(), view.tables.expected.marked?.length);
    await page.click('button[data-action="apply-merge"]');
    assert.deepEqual(await waitForPosted('applyMerge'), { type: 'applyMerge' });
    await page.click('button[data-action="run-exact"]');
    assert.deepEqual(await waitForPosted('runExact'), { type: 'runExact', method: 'exact' });
    await page.click('button[data-action="run-monte-carlo"]');
    assert.deepEqual((await posted()).pop(), { type: 'runExact', method: 'monte-carlo' });
    await screenshot('sparse-merge-dark');
  });

  it('hides the exact-test buttons when an exact p already leads', async () => {
    await open(buildPanelView(analyzed(BUS_DEPOT_SPARSE), 'depot-exact'));
    await page.waitForSelector('#merge-heading', { timeout: WAIT_MS }).catch(() => assert.fail('no merge section'));
    assert.equal(await page.locator('button[data-action="run-exact"]').count(), 0);
  });

  it('draws goodness of fit as one set of bars without a toggle or mosaic', async () => {
    const { view } = views.fit;
    assert.ok(view.chart);
    await open(view);
    assert.equal(await page.locator('[data-chart="proportions"] rect.bar').count(), view.chart.rowProportions.length);
    assert.equal(await page.locator('button[data-action="toggle-proportions"]').count(), 0);
    assert.equal(await page.locator('[data-chart="mosaic"]').count(), 0);
    assert.equal(await page.locator('table.heat-map td strong').count(), view.tables.residuals.marked?.length);
    await screenshot('goodness-of-fit-dark');
  });

  for (const how of ['message', 'embedded'] as const) {
    it(`keeps hostile labels as literal text (view sent as ${how === 'message' ? 'a message' : 'the embedded initial view'})`, async () => {
      const { view } = views.hostile;
      await open(view, how);
      const text = (await page.locator('#root').textContent()) ?? '';
      assert.ok(text.includes(HOSTILE_ROW), 'the row label shows as text');
      assert.ok(text.includes(HOSTILE_COLUMN), 'the column label shows as text');
      assert.equal(await page.locator('img').count(), 0, 'no <img> element was created');
      assert.equal(await page.locator('script').count(), 1, 'no script element besides the bundle');
      assert.equal(await page.locator('table.observed th[scope="row"]').first().textContent(), HOSTILE_ROW);
      const svgText = await page.locator('[data-chart="proportions"] svg').textContent();
      assert.ok(svgText?.includes('</script>'), 'chart labels are text too');
      if (how === 'embedded') await screenshot('hostile-labels-dark');
    });
  }

  it('runs under the panel\'s CSP: an injected inline script is blocked', async () => {
    await open(views.table2x2.view);
    await page.evaluate(() => {
      const script = (document as unknown as { createElement(tag: string): PageElement & { textContent: string } }).createElement('script');
      script.textContent = 'window.__inlineRan = true;';
      (document as unknown as { body: { append(node: unknown): void } }).body.append(script);
    });
    await page.waitForFunction(() => window.__violations.length > 0, undefined, { timeout: WAIT_MS })
      .catch(() => assert.fail('the CSP reported no violation for an inline script'));
    const outcome = await page.evaluate(() => {
      const w = window as PageWindow & { __inlineRan?: boolean };
      const violations = [...w.__violations];
      w.__violations = [];
      return { ran: w.__inlineRan === true, violations };
    });
    assert.equal(outcome.ran, false, 'the inline script did not run');
    assert.ok(outcome.violations.every((v) => v.startsWith('script-src')), `violations: ${outcome.violations.join('; ')}`);
    problems = problems.filter((problem) => !/console error: .*Content Security Policy/.test(problem));
  });

  it('restores the last view from getState after a reload, without a new message from the host', async () => {
    const { view } = views.table4x3;
    await open(view);
    const saved = await page.evaluate(() => window.__state);
    assert.deepEqual(saved, view);
    await page.addInitScript((state) => (window.__restoredState = state), saved);
    await page.reload();
    await page.waitForSelector('h1', { timeout: WAIT_MS }).catch(() => assert.fail('the restored panel never rendered'));
    assert.equal(await page.locator('h1').textContent(), view.title);
    assert.deepEqual(await posted(), [{ type: 'ready' }], 'only ready was posted after the reload');
  });

  it('announces busy and notice messages in a polite live region and ignores malformed messages', async () => {
    await open(views.table2x2.view);
    const status = page.locator('#status');
    assert.equal(await status.getAttribute('role'), 'status');
    assert.equal(await status.getAttribute('aria-live'), 'polite');
    await page.evaluate(() => window.postMessage({ type: 'busy', message: 'Running the exact test…' }, '*'));
    await page.waitForFunction(() => document.getElementById('status')?.textContent === 'Running the exact test…', undefined, { timeout: WAIT_MS })
      .catch(() => assert.fail('busy message not shown'));
    assert.equal(await page.locator('#root').getAttribute('aria-busy'), 'true');
    await page.evaluate(() => window.postMessage({ type: 'show', view: { title: 'no tables' } }, '*'));
    await page.evaluate(() => window.postMessage({ type: 'notice', message: 'The exact search stopped at its time limit.' }, '*'));
    await page.waitForFunction(() => document.getElementById('status')?.textContent === 'The exact search stopped at its time limit.', undefined, { timeout: WAIT_MS })
      .catch(() => assert.fail('notice message not shown'));
    assert.equal(await page.locator('h1').textContent(), views.table2x2.view.title, 'the malformed show was ignored');
  });

  it('reaches the buttons by keyboard with a visible focus outline', async () => {
    await open(views.table2x2.view);
    let reached = '';
    for (let i = 0; i < 5 && reached !== 'BUTTON'; i++) {
      await page.keyboard.press('Tab');
      reached = await page.evaluate(() => document.activeElement?.tagName ?? '');
    }
    assert.equal(reached, 'BUTTON');
    const outline = await page.evaluate(() => {
      const style = getComputedStyle(document.activeElement as PageElement);
      return `${style.outlineStyle} ${style.outlineWidth}`;
    });
    assert.equal(outline, 'solid 2px');
    await page.keyboard.press('Enter');
    const last = (await posted()).pop();
    assert.ok(last && last.type !== 'ready', 'Enter on the focused button posts its message');
  });
  it('draws the plan\'s power curve: one segment per point, rising, the target line and the planned marker, with N shown', async () => {
    const view = planView({ design: 'two-proportions', p1: 0.04, p2: 0.08, allocationRatio: 2 }, { groupLabels: ['Online', 'Front desk'] });
    await openPlan(view, 'two-proportions');
    assert.equal(await page.locator('h1').textContent(), view.title);
    assert.equal(await page.locator('.plan-headline').textContent(), view.headline);
    assert.deepEqual(await page.locator('dl.plan-facts dt').allTextContents(), view.facts.map((fact) => fact.label));
    assert.deepEqual(await page.locator('dl.plan-facts dd').allTextContents(), view.facts.map((fact) => fact.value));
    const chart = page.locator('[data-chart="power-curve"] svg');
    assert.equal(await chart.getAttribute('role'), 'img');
    assert.equal(await chart.getAttribute('aria-labelledby'), 'power-curve-title power-curve-desc');
    assert.equal(await chart.locator('title#power-curve-title').textContent(), view.curve.title);
    assert.equal(await chart.locator('desc#power-curve-desc').textContent(), view.curve.description);
    const d = (await chart.locator('path.power-curve').getAttribute('d')) ?? '';
    const coordinates = [...d.matchAll(/[ML]([\d.]+) ([\d.]+)/g)].map((match) => [Number(match[1]), Number(match[2])]);
    assert.equal(coordinates.length, view.curve.points.length, 'one vertex per point');
    for (let i = 1; i < coordinates.length; i++) {
      assert.ok(coordinates[i][0] > coordinates[i - 1][0], 'N increases to the right');
      assert.ok(coordinates[i][1] <= coordinates[i - 1][1], 'power rises (SVG y falls)');
    }
    const targetY = Number(await chart.locator('line.target-line').getAttribute('y1'));
    const marker = chart.locator('circle.planned-marker');
    assert.equal(await marker.locator('title').textContent(), view.curve.planned.label);
    assert.ok(Number(await marker.getAttribute('cy')) <= targetY + 0.1, 'the planned N reaches the target power (to the 0.1 px the marker is drawn at)');
    const markerX = Number(await marker.getAttribute('cx'));
    assert.ok(markerX > coordinates[0][0] && markerX < coordinates[coordinates.length - 1][0]);
    assert.deepEqual(await chart.locator('text.x-tick').allTextContents(), view.curve.xTicks.map((tick) => tick.label));
    assert.ok((await chart.textContent())?.includes(view.curve.target.label));
    const details = page.locator('details.curve-table');
    assert.equal(await details.getAttribute('open'), null, 'the data table starts folded');
    await details.locator('summary').click();
    assert.equal(await page.locator('table.power-curve-table tbody tr').count(), view.curve.points.length);
    assert.equal(await page.locator('table.power-curve-table caption').textContent(), view.curve.table.caption);
    assert.equal(await page.locator('.plan-paragraph').textContent(), view.paragraph);
    await screenshot('plan-two-proportions-dark');
  });

  it('posts insertPlan and copyPlan from the plan buttons, and offers only Copy with the reason when there is no document', async () => {
    await openPlan(planView({ design: 'effect-size', w: 0.3, df: 2 }, { insertLabel: 'Insert below line 4' }), 'buttons');
    assert.equal(await page.locator('button[data-action="insert-plan"]').textContent(), 'Insert below line 4');
    await page.click('button[data-action="insert-plan"]');
    assert.deepEqual(await waitForPosted('insertPlan'), { type: 'insertPlan' });
    await page.click('button[data-action="copy-plan"]');
    assert.deepEqual(await waitForPosted('copyPlan'), { type: 'copyPlan' });
    await openPlan(planView({ design: 'effect-size', w: 0.3, df: 2 }, { insertUnavailable: 'No notes were open.' }), 'copy-only');
    assert.equal(await page.locator('button[data-action="insert-plan"]').count(), 0);
    assert.equal(await page.locator('button[data-action="copy-plan"]').count(), 1);
    assert.ok((await page.locator('#plan-paragraph-heading + p + .button-row + p').textContent())?.includes('No notes were open.'));
  });

  it('keeps hostile group labels in a plan view as literal text', async () => {
    const view = planView({ design: 'independence', groups: [[0.7, 0.3], [0.5, 0.5]] }, { groupLabels: [HOSTILE_ROW, HOSTILE_COLUMN], origin: `the table of ${HOSTILE_COLUMN}` });
    await openPlan(view, 'hostile');
    const text = (await page.locator('#root').textContent()) ?? '';
    assert.ok(text.includes(HOSTILE_ROW) && text.includes(HOSTILE_COLUMN), 'the labels show as text');
    assert.equal(await page.locator('img').count(), 0, 'no <img> element was created');
    assert.equal(await page.locator('script').count(), 1, 'no script element besides the bundle');
    assert.ok((await page.locator('.plan-headline').textContent())?.includes(HOSTILE_ROW));
  });

  it('restores a plan view from getState after a reload, and ignores a malformed plan', async () => {
    const view = planView({ design: 'effect-size', w: 0.5, df: 1 });
    await openPlan(view, 'restore');
    const saved = await page.evaluate(() => window.__state);
    assert.deepEqual(saved, view);
    await page.evaluate(() => window.postMessage({ type: 'showPlan', view: { kind: 'plan', title: 'broken' } }, '*'));
    await page.addInitScript((state) => (window.__restoredState = state), saved);
    await page.reload();
    await page.waitForSelector('.plan-headline', { timeout: WAIT_MS }).catch(() => assert.fail('the restored plan never rendered'));
    assert.equal(await page.locator('.plan-headline').textContent(), view.headline);
    assert.equal(await page.locator('[data-chart="power-curve"] circle.planned-marker').count(), 1);
  });
});

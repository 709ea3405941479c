import * as vscode from 'vscode';
import type { PlanRequest } from '../../core/plan/planStudy';
import type { PlanResult, SensitivityResult } from '../../core/plan/types';
import type { Result } from '../../core/types';
import type { PlanView } from '../../protocol/planView';
import type { Command } from '../command';
import { COMMAND_ID } from '../commandIds';
import { documentFormat } from '../documentFormat';
import { editorRequest } from '../editorRequest';
import { loadEngine, type Engine } from '../loadEngine';
import type { TableForPlan } from '../planFromTable';
import { typedAllocation, typedNumber } from '../planInputs';
import { PlanPanel, type PlanActions } from '../planPanel';
import type { PlanViewSource } from '../planPanelView';
import { planAnchor, planParagraphInsertion, type PlanAnchor } from '../planParagraphInsertion';
import type { Tallywise } from '../tallywise';

const FROM_TABLE = 'table';
const FROM_EFFECT_SIZE = 'w';
const FROM_TWO_PROPORTIONS = 'two';
const SENSITIVITY = 'sensitivity';
const TITLE = 'Tallywise: plan the sample size';
/**
 * The table at the cursor is read before the first question (to offer the sensitivity choice) only in
 * documents up to this size; a large file of raw observations is read once chosen, so the first
 * question never waits on it.
 */
const EAGER_READ_CHARACTERS = 1_000_000;

/** The table at the cursor, read for planning (or why there is none), once asked for. */
interface TableHere {
  document: vscode.TextDocument;
  read(): Result<TableForPlan>;
  /** Already read: the sensitivity choice can be offered. */
  readNow?: Result<TableForPlan>;
}

/** A computed plan or sensitivity, how to describe it, and where its paragraph may go. */
interface Prepared {
  result: PlanResult | SensitivityResult;
  source: PlanViewSource;
  destination?: { uri: vscode.Uri; anchor: PlanAnchor };
}

/**
 * Plans the sample size of the next study in a few steps: from the table at the cursor (read as the
 * anticipated table), an effect size w, or two proportions, with the allocation between groups, the
 * significance level and the target power; or, for a table already analysed, the smallest effect
 * its size could detect (sensitivity, never observed power). The result and its power curve open in
 * the results panel, whose buttons insert the planning paragraph (below the table, or below the
 * cursor's line) in one edit, or copy it.
 */
export class PlanStudyCommand implements Command {
  readonly id = COMMAND_ID.planStudy;
  private panel: PlanPanel | undefined;

  constructor(private readonly tallywise: Tallywise) {}

  /** @returns true when a plan was shown */
  async execute(...args: unknown[]): Promise<boolean> {
    const engine = loadEngine();
    const here = await this.tableHere(engine, args);
    const items = [
      { label: vscode.l10n.t('From the table at the cursor'), description: vscode.l10n.t('a pilot or anticipated table of counts'), id: FROM_TABLE },
      { label: vscode.l10n.t('From an effect size w'), description: vscode.l10n.t('with the degrees of freedom of the test'), id: FROM_EFFECT_SIZE },
      { label: vscode.l10n.t('Two proportions'), description: vscode.l10n.t('the proportion expected in each of two groups'), id: FROM_TWO_PROPORTIONS },
    ];
    if (here?.readNow?.ok) {
      items.push({
        label: vscode.l10n.t('Smallest effect this table could detect'),
        description: vscode.l10n.t('for a study already run: what its size could detect (not observed power)'),
        id: SENSITIVITY,
      });
    }
    const choice = await vscode.window.showQuickPick(items, { title: vscode.l10n.t(TITLE), placeHolder: vscode.l10n.t('What do you know about the effect you expect?') });
    if (!choice) return false;
    const prepared = await this.prepare(engine, choice.id, here);
    if (!prepared) return false;
    const view = engine.buildPlanView(prepared.result, prepared.source);
    this.tallywise.log.info(`${view.headline}\n${view.paragraph}`);
    this.show(view, this.actions(view, prepared.destination));
    return true;
  }

  private async tableHere(engine: Engine, args: unknown[]): Promise<TableHere | undefined> {
    const target = await this.tallywise.target(args).catch((error: unknown) => {
      this.tallywise.log.warn(`The plan command could not open what it was pointed at: ${error instanceof Error ? error.message : String(error)}`);
      return undefined;
    });
    if (!target) return undefined;
    const { document } = target;
    let result: Result<TableForPlan> | undefined;
    const read = () => (result ??= engine.planFromTable(editorRequest(document.getText(), documentFormat(document.languageId, document.fileName), target.selection, target.line)));
    return { document, read, readNow: document.getText().length <= EAGER_READ_CHARACTERS ? read() : undefined };
  }

  private async prepare(engine: Engine, source: string, here: TableHere | undefined): Promise<Prepared | undefined> {
    if (source === FROM_TABLE || source === SENSITIVITY) {
      if (!here) {
        void vscode.window.showInformationMessage(vscode.l10n.t('Tallywise: open your notes and put the cursor in a table of counts first.'));
        return undefined;
      }
      const read = here.read();
      if (!read.ok) {
        this.tallywise.report(read.issue.code, read.issue.message);
        return undefined;
      }
      const table = read.value;
      const where = this.tableDestination(here.document, table);
      if (source === SENSITIVITY) return this.sensitivity(engine, table, where);
      const request = table.groups ? await this.groupsRequest(table.groups, table.rowLabels) : await this.fitRequest(engine, table);
      if (!request) return undefined;
      const labels = table.groups ? table.rowLabels : undefined;
      return this.planned(engine, request, { ...where, source: { ...where.source, groupLabels: labels } });
    }
    let request: PlanRequest;
    if (source === FROM_EFFECT_SIZE) {
      const w = await this.askNumber(vscode.l10n.t('Effect size w (Cohen: 0.1 small, 0.3 medium, 0.5 large)'), '0.3', 'The effect size w', (value) => engine.checkEffectSize(value)?.message);
      if (w === undefined) return undefined;
      const df = await this.askNumber(vscode.l10n.t('Degrees of freedom of the test: (rows − 1) × (columns − 1)'), '1', 'The degrees of freedom', (value) => engine.checkDf(value)?.message);
      if (df === undefined) return undefined;
      request = { design: 'effect-size', w, df };
    } else {
      const pair = await this.ask(vscode.l10n.t('Proportions expected in group 1 and group 2'), '0.04, 0.08', (value) => twoProportions(value).message);
      if (pair === undefined) return undefined;
      const [p1, p2] = twoProportions(pair).values as [number, number];
      const weights = await this.askAllocation(['group 1', 'group 2']);
      if (!weights) return undefined;
      request = { design: 'two-proportions', p1, p2, allocationRatio: weights[1] / weights[0] };
    }
    return this.planned(engine, request, this.cursorDestination());
  }

  private async groupsRequest(groups: number[][], labels: string[]): Promise<PlanRequest | undefined> {
    const allocation = await this.askAllocation(labels);
    return allocation ? { design: 'independence', groups, allocation } : undefined;
  }

  private async fitRequest(engine: Engine, table: TableForPlan): Promise<PlanRequest | undefined> {
    const categories = table.categories!;
    const nullText = await this.ask(vscode.l10n.t('Null proportions for {0}', categories.labels.join(', ')), '0.25, 0.5, 0.25', (value) => {
      const parsed = engine.parseProportionGroups(value);
      if (!parsed.ok) return parsed.issue.message;
      if (parsed.value.length !== 1 || parsed.value[0].length !== categories.labels.length) return vscode.l10n.t('Give {0} proportions, one per category.', categories.labels.length);
      return engine.checkProportions(parsed.value[0], 'the null proportions')?.message;
    });
    if (nullText === undefined) return undefined;
    const parsed = engine.parseProportionGroups(nullText);
    if (!parsed.ok) return undefined;
    return { design: 'goodness-of-fit', anticipated: categories.proportions, nullProportions: parsed.value[0] };
  }

  /** Asks alpha and power, then plans; the engine's problems end in one message. */
  private async planned(engine: Engine, request: PlanRequest, where: Omit<Prepared, 'result'>): Promise<Prepared | undefined> {
    const settings = await this.askLevels(engine);
    if (!settings) return undefined;
    const result = engine.planStudy({ ...request, ...settings });
    if (!result.ok) {
      this.tallywise.report(result.issue.code, result.issue.message);
      return undefined;
    }
    return { ...where, result: result.value };
  }

  private async sensitivity(engine: Engine, table: TableForPlan, where: Omit<Prepared, 'result'>): Promise<Prepared | undefined> {
    const settings = await this.askLevels(engine);
    if (!settings) return undefined;
    const result = engine.sensitivityFromTable(table, settings.alpha, settings.power);
    if (!result.ok) {
      this.tallywise.report(result.issue.code, result.issue.message);
      return undefined;
    }
    return { ...where, result: result.value, source: { ...where.source, groupLabels: table.rowLabels, outcomeLabel: table.columnLabels[0] } };
  }

  private async askLevels(engine: Engine): Promise<{ alpha: number; power: number } | undefined> {
    const fromSettings = this.tallywise.settings().options.alpha ?? engine.DEFAULT_PLAN_ALPHA;
    const alpha = await this.askNumber(vscode.l10n.t('Significance level α of the test (two-sided)'), '0.05', 'The significance level', (value) => engine.checkAlpha(value)?.message, String(fromSettings), true);
    if (alpha === undefined) return undefined;
    const power = await this.askNumber(vscode.l10n.t('Target power'), '0.8', 'The target power', (value) => engine.checkPower(value, alpha)?.message, '0.8', true);
    if (power === undefined) return undefined;
    return { alpha, power };
  }

  /** Equal groups, or a ratio such as 2:1, one number per group. */
  private async askAllocation(groups: string[]): Promise<number[] | undefined> {
    const equal = groups.map(() => '1').join(':');
    const text = await this.ask(
      vscode.l10n.t('Allocation between the groups ({0}): {1} for equal sizes, or a ratio such as 2:1', groups.join(' : '), equal),
      equal,
      (value) => { const typed = typedAllocation(value, groups); return typed.ok ? undefined : typed.message; },
      equal,
    );
    if (text === undefined) return undefined;
    const typed = typedAllocation(text, groups);
    return typed.ok ? typed.value : undefined;
  }

  private tableDestination(document: vscode.TextDocument, table: TableForPlan): Omit<Prepared, 'result'> {
    const format = documentFormat(document.languageId, document.fileName);
    const name = document.uri.path.split('/').pop() ?? document.fileName;
    const origin = vscode.l10n.t('the table on lines {0}–{1} of {2}', table.startLine, table.endLine, name);
    if (format === 'delimited') return { source: { origin, insertUnavailable: notInCsv() } };
    const anchor = planAnchor(document.getText(), table.startLine, table.endLine, format, 'table');
    return { source: { origin, insertLabel: vscode.l10n.t('Insert below the table') }, destination: { uri: document.uri, anchor } };
  }

  private cursorDestination(): Omit<Prepared, 'result'> {
    const editor = this.tallywise.textEditor();
    if (!editor) return { source: { insertUnavailable: vscode.l10n.t('No notes were open when the plan was made, so there is nowhere to insert the paragraph; copy it instead.') } };
    const { document } = editor;
    const format = documentFormat(document.languageId, document.fileName);
    if (format === 'delimited') return { source: { insertUnavailable: notInCsv() } };
    const line = editor.selection.active.line + 1;
    return {
      source: { insertLabel: vscode.l10n.t('Insert below line {0}', line) },
      destination: { uri: document.uri, anchor: planAnchor(document.getText(), line, line, format, 'line') },
    };
  }

  private actions(view: PlanView, destination: Prepared['destination']): PlanActions {
    return {
      copy: async () => {
        await vscode.env.clipboard.writeText(view.paragraph);
        return vscode.l10n.t('The planning paragraph is on the clipboard.');
      },
      insert: async () => {
        if (!destination) return view.insertUnavailable ?? vscode.l10n.t('There is no document to insert into; copy the paragraph instead.');
        const document = await vscode.workspace.openTextDocument(destination.uri);
        const place = planParagraphInsertion(document.getText(), destination.anchor, view.paragraph);
        if (!place.ok) {
          void vscode.window.showWarningMessage(`Tallywise: ${place.message}`);
          return place.message;
        }
        const edit = new vscode.WorkspaceEdit();
        edit.insert(destination.uri, new vscode.Position(place.line, place.character), place.text);
        if (!(await vscode.workspace.applyEdit(edit))) return vscode.l10n.t('The editor did not accept the insertion; nothing was changed.');
        const { anchor } = destination;
        // The anchor follows its lines, so a second Insert still finds them.
        destination.anchor = { ...anchor, startLine: place.tableEndLine - (anchor.endLine - anchor.startLine), endLine: place.tableEndLine };
        return vscode.l10n.t('Inserted the planning paragraph below line {0}.', place.tableEndLine);
      },
    };
  }

  private show(view: PlanView, actions: PlanActions): void {
    if (this.panel && !this.panel.closed) {
      this.panel.update(view, actions);
      return;
    }
    this.panel = PlanPanel.open(this.tallywise, view, actions);
    this.tallywise.context.subscriptions.push(this.panel);
  }

  /** A number from a box: it must read as one, then pass the engine's check. */
  private async askNumber(prompt: string, placeHolder: string, what: string, check: (value: number) => string | undefined, value?: string, percent = false): Promise<number | undefined> {
    const validate = (text: string) => {
      const typed = typedNumber(text, what, percent);
      return typed.ok ? check(typed.value) : typed.message;
    };
    const answer = await this.ask(prompt, placeHolder, validate, value);
    if (answer === undefined) return undefined;
    const typed = typedNumber(answer, what, percent);
    return typed.ok && check(typed.value) === undefined ? typed.value : undefined;
  }

  private async ask(prompt: string, placeHolder: string, check: (value: string) => string | undefined, value?: string): Promise<string | undefined> {
    const answer = await vscode.window.showInputBox({
      title: vscode.l10n.t(TITLE), prompt, placeHolder, value, ignoreFocusOut: true,
      validateInput: (text) => (text.trim() === '' ? vscode.l10n.t('Enter a value, e.g. {0}.', placeHolder) : check(text.trim())),
    });
    return answer === undefined ? undefined : answer.trim();
  }
}

function notInCsv(): string {
  return vscode.l10n.t('A paragraph inside a CSV or TSV file would break it as data; copy it and paste it into your notes instead.');
}

/** "0.04, 0.08" → two distinct proportions in (0, 1), or what is wrong. */
function twoProportions(text: string): { values?: number[]; message?: string } {
  const values = text.split(/[,;\s]+/).filter((part) => part !== '').map(Number);
  if (values.length !== 2 || values.some((value) => !(value > 0 && value < 1))) return { message: 'Give two proportions between 0 and 1, separated by a comma, e.g. 0.04, 0.08.' };
  if (values[0] === values[1]) return { message: 'The two proportions are equal; there is no difference to detect.' };
  return { values };
}

import * as vscode from 'vscode';
import type { PlanRequest } from '../../core/plan/planStudy';
import type { Command } from '../command';
import { COMMAND_ID } from '../commandIds';
import { documentFormat } from '../documentFormat';
import { editorRequest } from '../editorRequest';
import { loadEngine, type Engine } from '../loadEngine';
import { planParagraphInsertion } from '../planParagraphInsertion';
import type { Tallywise } from '../tallywise';

const FROM_TABLE = 'table';
const FROM_EFFECT_SIZE = 'w';
const FROM_TWO_PROPORTIONS = 'two';

/** A planned study's paragraph, and where it may go. */
interface Planned {
  paragraph: string;
  summary: string;
  /** The document and 0-based line the paragraph would go below, when there is an editor. */
  document?: vscode.TextDocument;
  afterLine?: number;
}

/**
 * Plans the sample size of the next study in a few questions: from the table at the cursor, an effect
 * size w, or two proportions; then offers to insert the planning paragraph below the cursor (or below
 * the table) in one edit.
 */
export class PlanStudyCommand implements Command {
  readonly id = COMMAND_ID.planStudy;

  constructor(private readonly tallywise: Tallywise) {}

  async execute(...args: unknown[]): Promise<boolean> {
    const choice = await vscode.window.showQuickPick([
      { label: vscode.l10n.t('From the table at the cursor'), description: vscode.l10n.t('a pilot or anticipated table of counts'), id: FROM_TABLE },
      { label: vscode.l10n.t('From an effect size w'), description: vscode.l10n.t('with the degrees of freedom of the test'), id: FROM_EFFECT_SIZE },
      { label: vscode.l10n.t('Two proportions'), description: vscode.l10n.t('the proportion expected in each of two groups'), id: FROM_TWO_PROPORTIONS },
    ], { title: vscode.l10n.t('Tallywise: plan the sample size'), placeHolder: vscode.l10n.t('What do you know about the effect you expect?') });
    if (!choice) return false;
    const engine = loadEngine();
    const planned = await this.plan(engine, choice.id, args);
    if (!planned) return false;
    this.tallywise.log.info(`${planned.summary}\n${planned.paragraph}`);
    const insert = vscode.l10n.t('Insert the paragraph');
    const copy = vscode.l10n.t('Copy the paragraph');
    const answer = await vscode.window.showInformationMessage(`Tallywise: ${planned.summary}`, ...(planned.document ? [insert, copy] : [copy]));
    if (answer === copy) {
      await vscode.env.clipboard.writeText(planned.paragraph);
      return false;
    }
    if (answer !== insert || !planned.document || planned.afterLine === undefined) return false;
    const place = planParagraphInsertion(planned.document.getText(), planned.afterLine, planned.paragraph);
    const edit = new vscode.WorkspaceEdit();
    edit.insert(planned.document.uri, new vscode.Position(place.line, place.character), place.text);
    if (!(await vscode.workspace.applyEdit(edit))) {
      void vscode.window.showWarningMessage(vscode.l10n.t('Tallywise: the editor did not accept the insertion; nothing was changed.'));
      return false;
    }
    return true;
  }

  private async plan(engine: Engine, source: string, args: unknown[]): Promise<Planned | undefined> {
    const alpha = this.tallywise.settings().options.alpha ?? engine.DEFAULT_PLAN_ALPHA;
    const editor = this.tallywise.textEditor();
    let request: PlanRequest;
    let afterLine = editor?.selection.active.line;
    let document = editor?.document;
    if (source === FROM_TABLE) {
      const target = await this.tallywise.target(args);
      if (!target) {
        void vscode.window.showInformationMessage(vscode.l10n.t('Tallywise: open your notes and put the cursor in a table of counts first.'));
        return undefined;
      }
      const table = engine.planFromTable(editorRequest(target.document.getText(), documentFormat(target.document.languageId, target.document.fileName), target.selection, target.line));
      if (!table.ok) {
        this.tallywise.report(table.issue.code, table.issue.message);
        return undefined;
      }
      document = target.document;
      afterLine = table.value.endLine - 1;
      if (table.value.groups) request = { design: 'independence', groups: table.value.groups };
      else {
        const categories = table.value.categories!;
        const nullText = await this.ask(vscode.l10n.t('Null proportions for {0}', categories.labels.join(', ')), '0.25, 0.5, 0.25', (value) => {
          const parsed = engine.parseProportionGroups(value);
          if (!parsed.ok) return parsed.issue.message;
          if (parsed.value.length !== 1 || parsed.value[0].length !== categories.labels.length) return vscode.l10n.t('Give {0} proportions, one per category.', categories.labels.length);
          return engine.checkProportions(parsed.value[0], 'the null proportions')?.message;
        });
        if (nullText === undefined) return undefined;
        const parsed = engine.parseProportionGroups(nullText);
        if (!parsed.ok) return undefined;
        request = { design: 'goodness-of-fit', anticipated: categories.proportions, nullProportions: parsed.value[0] };
      }
    } else if (source === FROM_EFFECT_SIZE) {
      const w = await this.ask(vscode.l10n.t('Effect size w (Cohen: 0.1 small, 0.3 medium, 0.5 large)'), '0.3', (value) => engine.checkEffectSize(Number(value))?.message);
      if (w === undefined) return undefined;
      const df = await this.ask(vscode.l10n.t('Degrees of freedom of the test: (rows − 1) × (columns − 1)'), '1', (value) => engine.checkDf(Number(value))?.message);
      if (df === undefined) return undefined;
      request = { design: 'effect-size', w: Number(w), df: Number(df) };
    } else {
      const pair = await this.ask(vscode.l10n.t('Proportions expected in group 1 and group 2'), '0.04, 0.08', (value) => twoProportions(value).message);
      if (pair === undefined) return undefined;
      const [p1, p2] = twoProportions(pair).values as [number, number];
      request = { design: 'two-proportions', p1, p2 };
    }
    const power = await this.ask(vscode.l10n.t('Target power'), '0.8', (value) => engine.checkPower(Number(value), alpha)?.message, '0.8');
    if (power === undefined) return undefined;
    const result = engine.planStudy({ ...request, alpha, power: Number(power) });
    if (!result.ok) {
      this.tallywise.report(result.issue.code, result.issue.message);
      return undefined;
    }
    const plan = result.value;
    const groups = plan.perGroup.length > 1 ? vscode.l10n.t(' ({0} per group)', plan.perGroup.join(', ')) : '';
    const summary = vscode.l10n.t('plan N = {0}{1}; power {2} at w = {3}, df = {4}, alpha = {5}.', plan.n, groups, plan.achievedPower.toFixed(3), plan.w.toFixed(3), plan.df, plan.alpha);
    return { paragraph: engine.writePlan(plan), summary, document, afterLine };
  }

  private async ask(prompt: string, placeHolder: string, check: (value: string) => string | undefined, value?: string): Promise<string | undefined> {
    const answer = await vscode.window.showInputBox({
      title: vscode.l10n.t('Tallywise: plan the sample size'), prompt, placeHolder, value, ignoreFocusOut: true,
      validateInput: (text) => (text.trim() === '' ? vscode.l10n.t('Enter a value, e.g. {0}.', placeHolder) : check(text.trim())),
    });
    return answer === undefined ? undefined : answer.trim();
  }
}

/** "0.04, 0.08" → two distinct proportions in (0, 1), or what is wrong. */
function twoProportions(text: string): { values?: number[]; message?: string } {
  const values = text.split(/[,;\s]+/).filter((part) => part !== '').map(Number);
  if (values.length !== 2 || values.some((value) => !(value > 0 && value < 1))) return { message: 'Give two proportions between 0 and 1, separated by a comma, e.g. 0.04, 0.08.' };
  if (values[0] === values[1]) return { message: 'The two proportions are equal; there is no difference to detect.' };
  return { values };
}

import * as vscode from 'vscode';
import type { OrderedDimensions, StudyDesign } from '../../core/designs/designOptions';
import type { Command } from '../command';
import { COMMAND_ID } from '../commandIds';
import { documentFormat } from '../documentFormat';
import { editorRequest } from '../editorRequest';
import { loadEngine } from '../loadEngine';
import type { TableShape } from '../tableShape';
import type { DesignChoice, Tallywise } from '../tallywise';

type DesignPick = vscode.QuickPickItem & { design: StudyDesign | 'ordered' };
type OrderPick = vscode.QuickPickItem & { ordered: Exclude<OrderedDimensions, 'auto' | 'none'> };

/**
 * Asks how the counts were collected before testing: independent groups, the same units twice
 * (paired), several strata, or ordered categories (with their scores). Each answer picks the test.
 */
export class CheckTableAsCommand implements Command {
  readonly id = COMMAND_ID.checkTableAs;

  constructor(private readonly tallywise: Tallywise) {}

  async execute(...args: unknown[]): Promise<void> {
    const target = await this.tallywise.targetOrHint(args, vscode.l10n.t('Tallywise: open a notes or CSV file and put the cursor in a table of counts first.'));
    if (!target) return;
    const { document } = target;
    const format = documentFormat(document.languageId, document.fileName);
    const raw = format === 'delimited' && loadEngine().rawDataColumns(document.getText()) !== undefined;
    const design = await vscode.window.showQuickPick<DesignPick>([
      { design: 'independent', label: vscode.l10n.t('Independent groups'), detail: vscode.l10n.t('Each observation is a different unit, counted once in one group.') },
      { design: 'paired', label: vscode.l10n.t('The same units measured twice (paired 2×2)'), detail: vscode.l10n.t('Before and after, or two raters: first answer in the rows, second in the columns. McNemar\'s test.') },
      {
        design: 'stratified',
        label: vscode.l10n.t('The same 2×2 comparison in several strata'),
        detail: raw
          ? vscode.l10n.t('Raw data with a column for the site, shift or batch. Cochran–Mantel–Haenszel test.')
          : vscode.l10n.t('2×2 tables one after another with the same labels, one per site, shift or batch. Cochran–Mantel–Haenszel test.'),
      },
      { design: 'ordered', label: vscode.l10n.t('Ordered categories'), detail: vscode.l10n.t('Doses, age bands, ratings: adds a test for a steady trend along the order.') },
    ], { title: vscode.l10n.t('Tallywise: how were these counts collected?'), ignoreFocusOut: true });
    if (!design) return;
    if (design.design !== 'ordered') {
      const choice: DesignChoice = { options: { design: design.design }, askStratum: design.design === 'stratified' && raw };
      await this.tallywise.analyzeTarget(target, undefined, choice);
      return;
    }
    const request = editorRequest(document.getText(), format, target.selection, target.line);
    const shape = loadEngine().tableShape(request);
    if (!shape.ok) {
      this.tallywise.report(shape.issue.code, shape.issue.message);
      return;
    }
    const ordered = await this.askOrder(shape.value);
    if (!ordered) return;
    const scores = await this.askScores(shape.value, ordered);
    if (scores === null) return;
    await this.tallywise.analyzeTarget(target, undefined, { options: { design: 'independent', ordered, ...scores } });
  }

  private async askOrder(shape: TableShape): Promise<OrderPick['ordered'] | undefined> {
    const items: OrderPick[] = [
      { ordered: 'columns', label: vscode.l10n.t('The columns are ordered'), description: shape.columnLabels.join(' < '), picked: shape.columnsOrdered },
      { ordered: 'rows', label: vscode.l10n.t('The rows are ordered'), description: shape.rowLabels.join(' < '), picked: shape.rowsOrdered },
      { ordered: 'both', label: vscode.l10n.t('Both are ordered'), description: vscode.l10n.t('linear-by-linear association test') },
    ];
    // Offer first what the labels suggest (numbers or ranges read as ordered).
    items.sort((a, b) => Number(b.picked ?? false) - Number(a.picked ?? false));
    const picked = await vscode.window.showQuickPick(items, { title: vscode.l10n.t('Tallywise: which categories have an order?'), ignoreFocusOut: true });
    return picked?.ordered;
  }

  /** Scores per ordered dimension; empty input keeps equally spaced scores. null when dismissed. */
  private async askScores(shape: TableShape, ordered: OrderPick['ordered']): Promise<{ rowScores?: number[]; columnScores?: number[] } | null> {
    const engine = loadEngine();
    const out: { rowScores?: number[]; columnScores?: number[] } = {};
    const dimensions = ordered === 'both' ? (['rows', 'columns'] as const) : [ordered];
    for (const dimension of dimensions) {
      const labels = dimension === 'rows' ? shape.rowLabels : shape.columnLabels;
      const typed = await vscode.window.showInputBox({
        title: vscode.l10n.t('Tallywise: scores for the ordered {0}', dimension),
        prompt: vscode.l10n.t('One number per category in order ({0}); leave empty for equally spaced scores 0, 1, 2, …', labels.join(', ')),
        placeHolder: labels.map((_, index) => index).join(', '),
        ignoreFocusOut: true,
        validateInput: (value) => {
          const parsed = engine.parseScores(value, labels.length);
          return parsed.ok ? undefined : parsed.issue.message;
        },
      });
      if (typed === undefined) return null;
      const parsed = engine.parseScores(typed, labels.length);
      if (parsed.ok && parsed.value) out[dimension === 'rows' ? 'rowScores' : 'columnScores'] = parsed.value;
    }
    return out;
  }
}

import * as vscode from 'vscode';
import type { Command } from '../command';
import { COMMAND_ID } from '../commandIds';
import { documentFormat } from '../documentFormat';
import { editorRequest } from '../editorRequest';
import { loadEngine } from '../loadEngine';
import type { Tallywise } from '../tallywise';

/** Goodness of fit to proportions the person types; the box checks the pattern against the table as they type. */
export class TestFitCommand implements Command {
  readonly id = COMMAND_ID.testFit;

  constructor(private readonly tallywise: Tallywise) {}

  async execute(...args: unknown[]): Promise<void> {
    const target = await this.tallywise.targetOrHint(args, vscode.l10n.t('Tallywise: open a notes or CSV file and put the cursor in a row or column of counts first.'));
    if (!target) return;
    const { document } = target;
    const engine = loadEngine();
    const request = editorRequest(document.getText(), documentFormat(document.languageId, document.fileName), target.selection, target.line);
    const categories = engine.fitCategories(request);
    if (!categories.ok) {
      this.tallywise.report(categories.issue.code, categories.issue.message);
      return;
    }
    const labels = categories.value;
    const pattern = await vscode.window.showInputBox({
      title: vscode.l10n.t('Tallywise: expected proportions'),
      prompt: vscode.l10n.t('Expected pattern for the {0} categories {1}', labels.length, labels.join(', ')),
      placeHolder: vscode.l10n.t('equal · 2:1:1 · 0.5, 0.3, 0.2 · 50%, 30%, 20% · poisson · binomial:4'),
      ignoreFocusOut: true,
      validateInput: (value) => {
        const spec = engine.parseFitSpec(value, labels.length);
        return spec.ok ? undefined : spec.issue.message;
      },
    });
    if (pattern === undefined) return;
    await this.tallywise.analyzeTarget(target, pattern.trim());
  }
}

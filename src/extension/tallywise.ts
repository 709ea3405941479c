import * as vscode from 'vscode';
import type { Analysis, AnalyzeOptions } from '../core/analysis';
import type { AnalyzeRequest } from '../core/analyze';
import type { Result } from '../core/types';
import { panelKey, tableLines, type AnalysisRecord } from './analysisRecord';
import type { TableJob } from './analysisWorker';
import { Disposable } from './dispose';
import { documentFormat } from './documentFormat';
import { editorRequest } from './editorRequest';
import { loadEngine } from './loadEngine';
import { ResultsPanels } from './resultsPanel';
import { runAnalysisInWorker } from './runAnalysisInWorker';
import { markupFor, readSettings, type TallywiseSettings } from './settings';

/** How the counts were collected, when a command asked: the design options and, for raw data, the stratum column. */
export interface DesignChoice {
  options: Partial<AnalyzeOptions>;
  /** Asks for the stratum column after the two columns are chosen (raw data, stratified design). */
  askStratum?: boolean;
}

/** What a command points at: a document, and the editor selection or a line (from a CodeLens). */
export interface Target {
  document: vscode.TextDocument;
  selection?: vscode.Selection;
  /** 0-based line, used when there is no selection. */
  line?: number;
}

/**
 * The extension's state and shared services: settings, the last text editor (while the panel has focus
 * `activeTextEditor` is undefined), running analyses in the worker, and the results panels.
 */
export class Tallywise extends Disposable {
  readonly log: vscode.LogOutputChannel;
  readonly panels: ResultsPanels;
  /** The most recent analysis, for "insert the last write-up" and "copy results". */
  lastRecord: AnalysisRecord | undefined;
  private lastEditor: vscode.TextEditor | undefined;
  /** Setting problems already shown, so each is shown once per session (they stay in the log). */
  private readonly shownProblems = new Set<string>();

  constructor(readonly context: vscode.ExtensionContext) {
    super();
    this.log = this._register(vscode.window.createOutputChannel('Tallywise', { log: true }));
    this.panels = this._register(new ResultsPanels(this));
    this.lastEditor = vscode.window.activeTextEditor;
    this._register(vscode.window.onDidChangeActiveTextEditor((editor) => {
      if (editor) this.lastEditor = editor;
    }));
  }

  settings(): TallywiseSettings {
    const configuration = vscode.workspace.getConfiguration('tallywise');
    const settings = readSettings((key) => configuration.get(key));
    for (const problem of settings.problems) {
      this.log.warn(problem);
      if (this.shownProblems.has(problem)) continue;
      this.shownProblems.add(problem);
      void vscode.window.showWarningMessage(`Tallywise: ${problem}`);
    }
    return settings;
  }

  /** The editor a command means: the active one, else the last text editor that had focus. */
  textEditor(): vscode.TextEditor | undefined {
    const editor = vscode.window.activeTextEditor ?? this.lastEditor;
    if (editor && editor.document.isClosed) return undefined;
    return editor;
  }

  /** Where the command's arguments point (a URI and line from a CodeLens or the context menu), else the editor's selection. */
  async target(args: unknown[]): Promise<Target | undefined> {
    const [first, second] = args;
    const uri = first instanceof vscode.Uri ? first : typeof first === 'string' ? vscode.Uri.parse(first) : undefined;
    const editor = this.textEditor();
    if (uri && typeof second === 'number') {
      const document = await vscode.workspace.openTextDocument(uri);
      return { document, line: second };
    }
    if (uri && (!editor || editor.document.uri.toString() !== uri.toString())) {
      return { document: await vscode.workspace.openTextDocument(uri), line: 0 };
    }
    if (!editor) return undefined;
    return { document: editor.document, selection: editor.selection };
  }

  /** The target, or a hint of what to open first when there is none. */
  async targetOrHint(args: unknown[], hint: string): Promise<Target | undefined> {
    const target = await this.target(args);
    if (!target) void vscode.window.showInformationMessage(hint);
    return target;
  }

  workerFile(): string {
    return this.context.asAbsolutePath('dist/analysisWorker.js');
  }

  /** Runs a job in the worker with a cancellable progress notification. */
  run(job: Omit<AnalyzeRequest, 'control'> | TableJob, title: string): Promise<Result<Analysis>> {
    return Promise.resolve(vscode.window.withProgress(
      { location: vscode.ProgressLocation.Notification, title, cancellable: true },
      (progress, token) => {
        const controller = new AbortController();
        const subscription = token.onCancellationRequested(() => controller.abort());
        let reported = 0;
        return runAnalysisInWorker(this.workerFile(), job, {
          signal: controller.signal,
          threads: this.settings().monteCarloThreads,
          onProgress: (fraction) => {
            const percent = Math.round(fraction * 100);
            if (percent > reported) progress.report({ increment: percent - reported, message: `${percent}%` });
            reported = Math.max(reported, percent);
          },
        }).finally(() => subscription.dispose());
      },
    ));
  }

  /**
   * Analyses the table a target points at and shows it in its panel. Every problem (no table, not counts,
   * cancelled) ends in one message and changes nothing.
   *
   * @param fit - a goodness-of-fit pattern, when the person gave one
   * @param design - paired, stratified or ordered options, when the person chose them
   * @returns the record shown, or undefined
   */
  async analyzeTarget(target: Target, fit?: string, design?: DesignChoice): Promise<AnalysisRecord | undefined> {
    const { document } = target;
    const format = documentFormat(document.languageId, document.fileName);
    const text = document.getText();
    const settings = this.settings();
    const request: Omit<AnalyzeRequest, 'control'> = {
      ...editorRequest(text, format, target.selection, target.line),
      fit,
      options: { ...settings.options, ...design?.options, markup: markupFor(format) },
    };
    if (format === 'delimited' && !request.selection && fit === undefined) {
      const columns = await this.chooseColumns(text);
      if (columns === null) return undefined;
      if (columns) request.columns = columns;
      if (columns && design?.askStratum) {
        const stratum = await this.chooseStratum(text, columns);
        if (stratum === undefined) return undefined;
        request.stratum = stratum;
      }
    }
    const result = await this.run(request, vscode.l10n.t('Tallywise: testing the table'));
    if (!result.ok) {
      this.report(result.issue.code, result.issue.message);
      return undefined;
    }
    const analysis = result.value;
    const uri = document.uri.toString();
    const record: AnalysisRecord = {
      key: panelKey(uri, analysis),
      analysis,
      job: request,
      charts: {},
      snapshot: {
        uri,
        version: document.version,
        path: document.uri.path,
        languageId: document.languageId,
        format,
        startLine: analysis.table.startLine,
        endLine: analysis.table.endLine,
        tableText: tableLines(text, analysis.table.startLine, analysis.table.endLine),
        crossTabulated: analysis.origin.crossTabulation !== undefined,
      },
    };
    const previous = this.panels.get(record.key)?.record;
    if (previous && previous.snapshot.version === record.snapshot.version) record.charts = previous.charts;
    this.show(record);
    return record;
  }

  /** Shows a record in its panel (the same table's panel is reused) and remembers it as the last one. */
  show(record: AnalysisRecord): void {
    this.lastRecord = record;
    const view = loadEngine().buildPanelView(record.analysis, record.key);
    this.panels.show(record, view);
  }

  /** One message for a failed analysis: cancellations are news, everything else a warning. */
  report(code: string, message: string): void {
    this.log.info(`${code}: ${message}`);
    if (code === 'cancelled') void vscode.window.showInformationMessage(`Tallywise: ${message}`);
    else void vscode.window.showWarningMessage(`Tallywise: ${message}`);
  }

  /** For raw observations in strata: which other column names each observation's stratum. */
  private async chooseStratum(text: string, chosen: [string, string]): Promise<string | undefined> {
    const columns = (loadEngine().rawDataColumns(text) ?? []).filter((column) => !chosen.includes(column));
    if (columns.length === 0) {
      void vscode.window.showWarningMessage(vscode.l10n.t('Tallywise: no other column is left to name the strata; a stratified analysis needs a column such as a site or a shift.'));
      return undefined;
    }
    const picked = await vscode.window.showQuickPick(columns, {
      title: vscode.l10n.t('Tallywise: strata'),
      placeHolder: vscode.l10n.t('Which column names the stratum (site, shift, batch) of each observation?'),
    });
    return picked;
  }

  /**
   * For a file of raw observations, asks which two columns to cross-tabulate.
   * @returns the pair, undefined for a table of counts, null when the person dismissed the choice
   */
  private async chooseColumns(text: string): Promise<[string, string] | undefined | null> {
    const columns = loadEngine().rawDataColumns(text);
    if (!columns) return undefined;
    const pairs: (vscode.QuickPickItem & { pair: [string, string] })[] = [];
    for (let a = 0; a < columns.length; a++) {
      for (let b = a + 1; b < columns.length; b++) {
        pairs.push({ label: `${columns[a]} × ${columns[b]}`, description: vscode.l10n.t('rows: {0}, columns: {1}', columns[a], columns[b]), pair: [columns[a], columns[b]] });
      }
    }
    const picked = await vscode.window.showQuickPick(pairs, {
      title: vscode.l10n.t('Tallywise: one row per observation'),
      placeHolder: vscode.l10n.t('Which two columns should be cross-tabulated and tested?'),
    });
    return picked ? picked.pair : null;
  }
}

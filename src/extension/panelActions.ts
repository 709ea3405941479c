import * as vscode from 'vscode';
import type { PanelToHost } from '../protocol/messages';
import type { AnalysisRecord } from './analysisRecord';
import { chartFilePath, isSafeSvg } from './chartFiles';
import { insertWriteUp } from './insertWriteUp';
import { loadEngine } from './loadEngine';
import type { ResultsPanel } from './resultsPanel';
import type { Tallywise } from './tallywise';

/** What the panel's buttons do. Every change to a document or file follows one of these explicit requests. */
export async function handlePanelMessage(tallywise: Tallywise, panel: ResultsPanel, message: Exclude<PanelToHost, { type: 'ready' }>): Promise<void> {
  if (message.type === 'copyWriteUp') {
    await vscode.env.clipboard.writeText(panel.record?.analysis.writeUp ?? panel.view.writeUp);
    panel.post({ type: 'notice', message: vscode.l10n.t('The write-up is on the clipboard.') });
    return;
  }
  const record = panel.record;
  if (!record) {
    panel.post({ type: 'notice', message: vscode.l10n.t('This panel was restored after a reload. Run "Tallywise: Check the count table here" on the table again to insert, merge or re-test.') });
    return;
  }
  switch (message.type) {
    case 'insertWriteUp':
      await insertWriteUp(record, { withExpectedTable: message.withExpectedTable, withChartLink: message.withChartLink });
      return;
    case 'applyMerge':
      await applyMerge(tallywise, panel, record);
      return;
    case 'runExact':
      await runExact(tallywise, panel, record, message.method);
      return;
    case 'saveChart':
      await saveChart(tallywise, panel, record, message.chart, message.svg);
      return;
  }
}

async function applyMerge(tallywise: Tallywise, panel: ResultsPanel, record: AnalysisRecord): Promise<void> {
  const merged = loadEngine().mergedCountTable(record.analysis);
  if (!merged.ok) {
    panel.post({ type: 'notice', message: merged.issue.message });
    return;
  }
  panel.post({ type: 'busy', message: vscode.l10n.t('Testing the merged table…') });
  const job = { kind: 'table' as const, table: merged.value, origin: record.analysis.origin, options: record.analysis.options };
  const result = await tallywise.run(job, vscode.l10n.t('Tallywise: testing the merged table'));
  if (!result.ok) {
    panel.post({ type: 'notice', message: result.issue.message });
    return;
  }
  tallywise.show({ ...record, analysis: result.value, job });
}

async function runExact(tallywise: Tallywise, panel: ResultsPanel, record: AnalysisRecord, method: 'exact' | 'monte-carlo'): Promise<void> {
  const job = 'kind' in record.job
    ? { ...record.job, options: { ...record.job.options, pValueMethod: method } }
    : { ...record.job, options: { ...record.job.options, pValueMethod: method } };
  panel.post({ type: 'busy', message: method === 'exact' ? vscode.l10n.t('Running the exact test…') : vscode.l10n.t('Running the Monte Carlo test…') });
  const result = await tallywise.run(job, method === 'exact' ? vscode.l10n.t('Tallywise: exact test') : vscode.l10n.t('Tallywise: Monte Carlo test'));
  if (!result.ok) {
    panel.post({ type: 'notice', message: result.issue.message });
    return;
  }
  tallywise.show({ ...record, analysis: result.value, job });
}

async function saveChart(tallywise: Tallywise, panel: ResultsPanel, record: AnalysisRecord, chart: 'proportions' | 'mosaic', svg: string): Promise<void> {
  const documentUri = vscode.Uri.parse(record.snapshot.uri);
  if (documentUri.scheme === 'untitled') {
    panel.post({ type: 'notice', message: vscode.l10n.t('Save the document first: the chart is written next to it.') });
    return;
  }
  if (!isSafeSvg(svg)) {
    tallywise.log.warn('The panel sent a chart that is not a plain SVG document; it was not written.');
    panel.post({ type: 'notice', message: vscode.l10n.t('The chart could not be saved (it is not a plain SVG image).') });
    return;
  }
  const target = chartFilePath(documentUri.path, record.snapshot.startLine, chart);
  const fileUri = documentUri.with({ path: target.path, query: '', fragment: '' });
  await vscode.workspace.fs.writeFile(fileUri, new TextEncoder().encode(svg));
  record.charts[chart] = target.relative;
  panel.post({ type: 'notice', message: vscode.l10n.t('Saved the chart as {0}; "Insert" can now link it.', target.relative) });
}

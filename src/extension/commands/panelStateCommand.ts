import type { PanelView } from '../../protocol/messages';
import type { AnalysisSnapshot, ChartKind } from '../analysisRecord';
import type { Command } from '../command';
import { COMMAND_ID } from '../commandIds';
import type { Tallywise } from '../tallywise';

/** What the end-to-end tests read through `tallywise.test.panelState`. */
export interface PanelStateForTests {
  /** The panel last shown or focused: its key and view, and whether it has its analysis (false after a restore). */
  panel: { key: string; view: PanelView; hasAnalysis: boolean; charts: Partial<Record<ChartKind, string>> } | undefined;
  /** The latest analysis's source, and its write-up. */
  lastSnapshot: AnalysisSnapshot | undefined;
  lastWriteUp: string | undefined;
  lastP: number | undefined;
  lastExactMethod: string | undefined;
  /** The latest analysis's test, sample size, degrees of freedom and Pearson statistic. */
  lastResult: { test: string; n: number; df: number; statistic: number } | undefined;
}

/** A test hook, hidden from the palette (`"when": "false"`): the state of the panel and the last analysis. */
export class PanelStateCommand implements Command {
  readonly id = COMMAND_ID.panelState;

  constructor(private readonly tallywise: Tallywise) {}

  execute(): PanelStateForTests {
    const panel = this.tallywise.panels.active();
    const last = this.tallywise.lastRecord;
    return {
      panel: panel && { key: panel.view.key, view: panel.view, hasAnalysis: panel.record !== undefined, charts: { ...panel.record?.charts } },
      lastSnapshot: last && { ...last.snapshot },
      lastWriteUp: last?.analysis.writeUp,
      lastP: last ? (last.analysis.exact?.p ?? last.analysis.result.p) : undefined,
      lastExactMethod: last?.analysis.exact?.method,
      lastResult: last && { test: last.analysis.result.test, n: last.analysis.result.n, df: last.analysis.result.df, statistic: last.analysis.result.statistic },
    };
  }
}

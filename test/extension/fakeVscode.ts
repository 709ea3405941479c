// A stand-in for the 'vscode' module, enough to activate the extension in plain Node: it records what
// activation registers. Shared by the manifest test and bench/extension.ts.
import Module from 'node:module';

const FAKE_VSCODE_ID = 'tallywise-fake-vscode';

export interface FakeVscode {
  registeredCommands: string[];
  codeLensSelectors: unknown[];
  serializers: string[];
  /** The registered panel serializers themselves, to restore a panel as VS Code does after a reload. */
  serializerObjects: { deserializeWebviewPanel(panel: unknown, state: unknown): Promise<void> }[];
  /** Command handlers by id, to run them as the workbench would. */
  commands: Map<string, (...args: unknown[]) => unknown>;
  panels: FakeWebviewPanel[];
  messages: { level: 'info' | 'warning' | 'error'; text: string }[];
  clipboard: string[];
  writtenFiles: Map<string, string>;
  documents: Map<string, FakeTextDocument>;
  /** What the next quick pick and input box answer (undefined: dismissed). */
  answers: { quickPick?: (items: { label: string }[]) => unknown; inputBox?: string };
  /** validateInput's verdicts on the texts in `probeInputs`, recorded when an input box opens. */
  probeInputs: string[];
  inputVerdicts: (string | undefined)[];
  /** The active editor, set by the test. */
  setActiveEditor(editor: FakeTextEditor | undefined): void;
  /** Puts the real module resolution back. */
  restore(): void;
}

export interface FakeTextDocument {
  uri: FakeUri;
  languageId: string;
  fileName: string;
  version: number;
  isClosed: boolean;
  text: string;
  getText(): string;
}

export interface FakeTextEditor {
  document: FakeTextDocument;
  selection: { start: Pos; end: Pos; active: Pos; isEmpty: boolean };
}

interface Pos { line: number; character: number }

export interface FakeWebviewPanel {
  viewType: string;
  title: string;
  active: boolean;
  disposed: boolean;
  posted: unknown[];
  webview: { html: string; options: unknown; cspSource: string; asWebviewUri(uri: FakeUri): FakeUri; postMessage(message: unknown): Promise<boolean>; onDidReceiveMessage(listener: (message: unknown) => void): Disposable };
  /** Sends a message as the panel's script would. */
  send(message: unknown): void;
  reveal(): void;
  onDidChangeViewState(): Disposable;
  onDidDispose(listener: () => void): Disposable;
  dispose(): void;
}

interface Disposable { dispose(): void }
const disposable = (): Disposable => ({ dispose: () => undefined });

class FakeEventEmitter<T> {
  private listeners: ((value: T) => void)[] = [];
  readonly event = (listener: (value: T) => void): Disposable => {
    this.listeners.push(listener);
    return disposable();
  };
  fire(value: T): void {
    for (const listener of this.listeners) listener(value);
  }
  dispose(): void {
    this.listeners = [];
  }
}

class FakeUri {
  constructor(readonly scheme: string, readonly path: string) {}
  with(change: { path?: string }): FakeUri {
    return new FakeUri(this.scheme, change.path ?? this.path);
  }
  static parse(text: string): FakeUri {
    const at = text.indexOf(':');
    return new FakeUri(text.slice(0, at), text.slice(at + 1));
  }
  static file(path: string): FakeUri {
    return new FakeUri('file', path);
  }
  static joinPath(base: FakeUri, ...parts: string[]): FakeUri {
    return new FakeUri(base.scheme, [base.path, ...parts].join('/'));
  }
  toString(): string {
    return `${this.scheme}:${this.path}`;
  }
}

/**
 * Makes `require('vscode')` return a recording fake until `restore()`.
 * @returns what activation registered
 */
export function installFakeVscode(): FakeVscode {
  let activeEditor: FakeTextEditor | undefined;
  const record: FakeVscode = {
    registeredCommands: [], codeLensSelectors: [], serializers: [], serializerObjects: [], commands: new Map(), panels: [], messages: [], clipboard: [],
    writtenFiles: new Map(), documents: new Map(), answers: {}, probeInputs: [], inputVerdicts: [],
    setActiveEditor: (editor) => { activeEditor = editor; },
    restore: () => undefined,
  };
  const message = (level: 'info' | 'warning' | 'error') => (text: string) => {
    record.messages.push({ level, text });
    return Promise.resolve(undefined);
  };
  const fake = {
    Position: class { constructor(readonly line: number, readonly character: number) {} },
    Range: class { constructor(readonly startLine: number, readonly startCharacter: number, readonly endLine: number, readonly endCharacter: number) {} },
    CodeLens: class { constructor(readonly range: unknown, readonly command: unknown) {} },
    WorkspaceEdit: class {
      readonly inserts: { uri: FakeUri; position: Pos; text: string }[] = [];
      insert(uri: FakeUri, position: Pos, text: string) { this.inserts.push({ uri, position, text }); }
    },
    env: { clipboard: { writeText: (text: string) => { record.clipboard.push(text); return Promise.resolve(); } } },
    Uri: FakeUri,
    EventEmitter: FakeEventEmitter,
    Disposable: class { constructor(private readonly callback: () => void) {} dispose() { this.callback(); } },
    ProgressLocation: { Notification: 15 },
    ViewColumn: { Beside: -2 },
    l10n: { t: (message: string, ...args: unknown[]) => message.replace(/\{(\d+)\}/g, (_, index: string) => String(args[Number(index)])) },
    commands: {
      registerCommand: (id: string, handler: (...args: unknown[]) => unknown) => {
        record.registeredCommands.push(id);
        record.commands.set(id, handler);
        return disposable();
      },
    },
    window: {
      get activeTextEditor() { return activeEditor; },
      showInformationMessage: message('info'),
      showWarningMessage: message('warning'),
      showErrorMessage: message('error'),
      withProgress: (_options: unknown, task: (progress: unknown, token: unknown) => unknown) =>
        task({ report: () => undefined }, { onCancellationRequested: () => disposable() }),
      showQuickPick: (items: { label: string }[]) => Promise.resolve(record.answers.quickPick?.(items)),
      showInputBox: (options: { validateInput?: (value: string) => string | undefined }) => {
        record.inputVerdicts = record.probeInputs.map((text) => options.validateInput?.(text));
        return Promise.resolve(record.answers.inputBox);
      },
      createWebviewPanel: (viewType: string, title: string): FakeWebviewPanel => {
        const listeners: ((message: unknown) => void)[] = [];
        const disposeListeners: (() => void)[] = [];
        const panel: FakeWebviewPanel = {
          viewType, title, active: true, disposed: false, posted: [],
          webview: {
            html: '', options: undefined, cspSource: 'fake-csp-source',
            asWebviewUri: (uri: FakeUri) => uri,
            postMessage: (sent: unknown) => { panel.posted.push(sent); return Promise.resolve(true); },
            onDidReceiveMessage: (listener: (message: unknown) => void) => { listeners.push(listener); return disposable(); },
          },
          send: (sent: unknown) => { for (const listener of listeners) listener(sent); },
          reveal: () => undefined,
          onDidChangeViewState: () => disposable(),
          onDidDispose: (listener: () => void) => { disposeListeners.push(listener); return disposable(); },
          dispose: () => {
            if (panel.disposed) return;
            panel.disposed = true;
            for (const listener of disposeListeners) listener();
          },
        };
        record.panels.push(panel);
        return panel;
      },
      createOutputChannel: () => ({ info: () => undefined, warn: () => undefined, error: () => undefined, appendLine: () => undefined, dispose: () => undefined }),
      onDidChangeActiveTextEditor: () => disposable(),
      registerWebviewPanelSerializer: (viewType: string, serializer: FakeVscode['serializerObjects'][number]) => {
        record.serializers.push(viewType);
        record.serializerObjects.push(serializer);
        return disposable();
      },
    },
    workspace: {
      openTextDocument: (uri: FakeUri) => {
        const document = record.documents.get(uri.toString());
        return document ? Promise.resolve(document) : Promise.reject(new Error(`no document ${uri.toString()}`));
      },
      applyEdit: (edit: { inserts: { uri: FakeUri; position: Pos; text: string }[] }) => {
        for (const insert of edit.inserts) {
          const document = record.documents.get(insert.uri.toString());
          if (!document) return Promise.resolve(false);
          const lines = document.text.split('\n');
          const offset = lines.slice(0, insert.position.line).reduce((sum, line) => sum + line.length + 1, 0) + insert.position.character;
          document.text = document.text.slice(0, offset) + insert.text + document.text.slice(offset);
          document.version += 1;
        }
        return Promise.resolve(true);
      },
      fs: { writeFile: (uri: FakeUri, bytes: Uint8Array) => { record.writtenFiles.set(uri.toString(), new TextDecoder().decode(bytes)); return Promise.resolve(); } },
      getConfiguration: () => ({ get: () => undefined }),
      onDidChangeConfiguration: () => disposable(),
    },
    languages: {
      registerCodeLensProvider: (selector: unknown) => {
        record.codeLensSelectors.push(selector);
        return disposable();
      },
    },
  };
  const moduleInternals = Module as unknown as { _resolveFilename: (request: string, ...rest: unknown[]) => string };
  const originalResolve = moduleInternals._resolveFilename;
  moduleInternals._resolveFilename = function (request: string, ...rest: unknown[]) {
    return request === 'vscode' ? FAKE_VSCODE_ID : originalResolve.call(this, request, ...rest);
  };
  require.cache[FAKE_VSCODE_ID] = { id: FAKE_VSCODE_ID, filename: FAKE_VSCODE_ID, loaded: true, exports: fake } as unknown as NodeModule;
  record.restore = () => {
    moduleInternals._resolveFilename = originalResolve;
    delete require.cache[FAKE_VSCODE_ID];
  };
  return record;
}

/** A text document the fake workbench can open and edit. */
export function fakeDocument(fake: FakeVscode, path: string, languageId: string, text: string): FakeTextDocument {
  const document: FakeTextDocument = {
    uri: FakeUri.file(path), languageId, fileName: path, version: 1, isClosed: false, text,
    getText() { return document.text; },
  };
  fake.documents.set(document.uri.toString(), document);
  return document;
}

/** An editor on a document with the cursor at a 0-based line. */
export function fakeEditor(document: FakeTextDocument, line: number): FakeTextEditor {
  const position = { line, character: 0 };
  return { document, selection: { start: position, end: position, active: position, isEmpty: true } };
}

/** A context with what activation reads. */
export function fakeExtensionContext(extensionPath: string): { subscriptions: Disposable[]; extensionUri: FakeUri; extensionPath: string; asAbsolutePath(relative: string): string } {
  return {
    subscriptions: [],
    extensionUri: FakeUri.file(extensionPath),
    extensionPath,
    asAbsolutePath: (relative: string) => `${extensionPath}/${relative}`,
  };
}

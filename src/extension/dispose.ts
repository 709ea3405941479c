import type * as vscode from 'vscode';

/** An owner of disposables: `_register(x)` returns x, or disposes it at once if the owner is already gone. */
export abstract class Disposable implements vscode.Disposable {
  private readonly disposables: vscode.Disposable[] = [];
  private disposed = false;

  protected get isDisposed(): boolean {
    return this.disposed;
  }

  protected _register<T extends vscode.Disposable>(value: T): T {
    if (this.disposed) value.dispose();
    else this.disposables.push(value);
    return value;
  }

  dispose(): void {
    if (this.disposed) return;
    this.disposed = true;
    while (this.disposables.length > 0) this.disposables.pop()?.dispose();
  }
}

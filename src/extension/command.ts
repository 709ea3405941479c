/** One command: its id and what it does. extension.ts registers a list of these and nothing else. */
export interface Command {
  readonly id: string;
  execute(...args: unknown[]): unknown;
}

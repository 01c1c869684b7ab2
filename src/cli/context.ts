/** What a command may touch of the outside world; tests pass their own. */
export interface CliContext {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** Whether stderr is a terminal (progress bars only then). */
  isTTY: boolean;
  debug: boolean;
}

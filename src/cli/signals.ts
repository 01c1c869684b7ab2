import type { CliContext } from './context.js';

/**
 * Run `fn` with Ctrl-C (SIGINT) and SIGTERM turned into a stop request: the run finishes the batch in flight,
 * writes a checkpoint and exits 130. A second signal ends the process at once (the default handlers return).
 */
export async function withStopSignals<T>(ctx: CliContext, fn: (shouldStop: () => boolean) => Promise<T>): Promise<T> {
  let stop = false;
  const onSignal = (sig: NodeJS.Signals) => {
    stop = true;
    ctx.stderr(`\n${sig}: finishing the batch in flight, then writing a checkpoint (send again to quit at once)\n`);
  };
  process.once('SIGINT', onSignal);
  process.once('SIGTERM', onSignal);
  try {
    return await fn(() => stop);
  } finally {
    process.removeListener('SIGINT', onSignal);
    process.removeListener('SIGTERM', onSignal);
  }
}

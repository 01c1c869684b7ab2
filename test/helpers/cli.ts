import { spawnSync } from 'node:child_process';
import { tmpdir } from 'node:os';
import { fileURLToPath } from 'node:url';

export const ROOT = fileURLToPath(new URL('../../', import.meta.url));
export const BIN = `${ROOT}bin/lumenfold.js`;

/**
 * Run the built binary (npm test builds first), by default in the system's temporary folder, so that test run
 * folders made with mkdtemp there are inside the working folder.
 */
export function runCli(args: string[], opts: { cwd?: string; input?: string; env?: Record<string, string> } = {}) {
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd: opts.cwd ?? tmpdir(), encoding: 'utf8', input: opts.input, env: { ...process.env, ...opts.env }, timeout: 300_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

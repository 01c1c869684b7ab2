// npm run bench: every benchmark section, side by side in one run. Machines are noisy: read the ratios.
import { existsSync } from 'node:fs';
import { runTransportBench } from './transport.js';
import { runWorkersBench } from './workers.js';

const quick = process.argv.includes('--quick');
const { hsr7Ms } = await runTransportBench(quick ? { sizes: [7, 16] } : {});
if (existsSync(new URL('./search.js', import.meta.url))) {
  const { runSearchBench } = await import('./search.js');
  const { overheadPerCandidateMs } = await runSearchBench({ quick });
  const share = (100 * overheadPerCandidateMs) / hsr7Ms;
  console.log(`\noptimizer overhead per candidate: ${overheadPerCandidateMs.toPrecision(3)} ms = ${share.toPrecision(3)}% of one 7-site hsr evaluation (${hsr7Ms.toPrecision(3)} ms); target under 5%`);
}
await runWorkersBench({ quick });

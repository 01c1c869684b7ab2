// npm run bench: every benchmark section, side by side in one run. Machines are noisy: read the ratios.
import { existsSync } from 'node:fs';
import { runTransportBench } from './transport.js';
import { demoCandidateMs } from './candidate.js';
import { runWorkersBench } from './workers.js';

const quick = process.argv.includes('--quick');
const { hsr7Ms } = await runTransportBench(quick ? { sizes: [7, 16] } : {});
if (existsSync(new URL('./search.js', import.meta.url))) {
  const { runSearchBench } = await import('./search.js');
  const { overheadPerCandidateMs } = await runSearchBench({ quick });
  const share = (100 * overheadPerCandidateMs) / hsr7Ms;
  const candidateMs = demoCandidateMs();
  console.log(`\noptimizer overhead per candidate: ${overheadPerCandidateMs.toPrecision(3)} ms = ${share.toPrecision(3)}% of one bare 7-site hsr evaluation (${hsr7Ms.toPrecision(3)} ms), ${((100 * overheadPerCandidateMs) / candidateMs).toPrecision(2)}% of scoring one demo candidate (7 dyes, redfield, nominal + 24 disorder samples: ${candidateMs.toPrecision(3)} ms); target under 5%`);
}
await runWorkersBench({ quick });

import { Command } from 'commander';
import type { CliContext } from '../context.js';
import { outputPath } from '../paths.js';

export function reportCommand(ctx: CliContext): Command {
  return new Command('report')
    .description('write one self-contained HTML file (works offline) about a run folder: run and configs, ranked designs, pictures, robustness, population dynamics and a 3-D view of the best design')
    .argument('<run-folder>', 'run folder written by lumenfold optimize')
    .option('--out <file>', 'report file (default: RUN_FOLDER/report.html)')
    .option('--force', 'overwrite an existing report')
    .option('--svg <folder>', 'also write every picture and chart as a standalone SVG file into this folder')
    .option('--allow-outside', 'allow --out and --svg to point outside the working folder')
    .option('--json', 'print the result as JSON on stdout')
    .action(async (folder: string, f: { out?: string; svg?: string; force?: boolean; allowOutside?: boolean; json?: boolean }) => {
      const out = f.out === undefined ? undefined : outputPath('--out', f.out, Boolean(f.allowOutside));
      const svgFolder = f.svg === undefined ? undefined : outputPath('--svg', f.svg, Boolean(f.allowOutside));
      // loaded here, not at start-up: the report carries the chart and 3-D viewer libraries, which every other
      // command would otherwise load for nothing
      const { writeRunReport } = await import('../../actions/report.js');
      const s = await writeRunReport({ runFolder: folder, out, svgFolder, force: Boolean(f.force) });
      for (const n of s.notes) ctx.stderr(`note: ${n}\n`);
      const svgs = s.svgFiles.length ? `svg     ${s.svgFiles.length} files in ${f.svg}\n` : '';
      ctx.stdout(f.json ? JSON.stringify(s, null, 2) + '\n' : `report  ${s.report} (${Math.round(s.bytes / 1024)} kB, ${s.designs} ranked designs)\n${svgs}`);
    });
}

import { Command, Option } from 'commander';
import { writeFileAtomic } from '../../output/atomic.js';
import { readDesignFile } from '../../output/design-file.js';
import { loadConfigFile } from '../../config/load.js';
import { EXPORT_FORMATS, exportDesign, type ExportFormat } from '../../actions/exports.js';
import { metricSettingsFrom } from '../../actions/settings.js';
import { safeOutputPath } from '../paths.js';
import type { CliContext } from '../context.js';

export function exportCommand(ctx: CliContext): Command {
  return new Command('export')
    .description('write a design as JSON, XYZ, PDB or a CSV site table, its Hamiltonian (cm^-1) or coupling table as CSV, or its anchor map')
    .argument('<design>', 'design file (lumenfold.design/1)')
    .addOption(new Option('--format <format>', 'export format').choices([...EXPORT_FORMATS]).makeOptionMandatory())
    .option('--objective <file>', 'take the coupling settings (dipole model, refractive index) from this objective recipe')
    .option('--out <file>', 'write to this file instead of stdout')
    .option('--force', 'overwrite an existing file')
    .option('--allow-outside', 'allow --out to point outside the working folder')
    .action((file: string, f: { format: ExportFormat; objective?: string; out?: string; force?: boolean; allowOutside?: boolean }) => {
      const rec = readDesignFile(file);
      const system = f.objective ? metricSettingsFrom(loadConfigFile(f.objective, 'objective'), rec.sites.length).system : undefined;
      const text = exportDesign(rec, f.format, system);
      if (!f.out) { ctx.stdout(text); return; }
      writeFileAtomic(safeOutputPath('--out', f.out, Boolean(f.force), Boolean(f.allowOutside)), text);
    });
}

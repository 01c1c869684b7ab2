import { Command, Option } from 'commander';
import { EXPORT_FORMATS, type ExportFormat } from '../../actions/export-formats.js';
import type { MetricSettings } from '../../metrics/evaluate.js';
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
    .action(async (file: string, f: { format: ExportFormat; objective?: string; out?: string; force?: boolean; allowOutside?: boolean }) => {
      const [{ readDesignFile }, { exportDesign }] = await Promise.all([import('../../output/design-file.js'), import('../../actions/exports.js')]);
      const rec = readDesignFile(file);
      let system: MetricSettings['system'] | undefined;
      if (f.objective) {
        const [{ loadConfigFile }, { metricSettingsFrom }] = await Promise.all([import('../../config/load.js'), import('../../actions/settings.js')]);
        system = metricSettingsFrom(loadConfigFile(f.objective, 'objective'), rec.sites.length).system;
      }
      const text = exportDesign(rec, f.format, system);
      if (!f.out) { ctx.stdout(text); return; }
      const { writeFileAtomic } = await import('../../output/atomic.js');
      writeFileAtomic(safeOutputPath('--out', f.out, Boolean(f.force), Boolean(f.allowOutside)), text);
    });
}

import { Command } from 'commander';
import { formatIssue } from '../../config/config-error.js';
import { InputError } from '../../errors.js';
import type { CliContext } from '../context.js';

export function checkCommand(ctx: CliContext): Command {
  return new Command('check')
    .description('validate constraint, objective, palette and sweep files; report every error with its path in the file')
    .argument('<files...>', 'config files (YAML or JSON)')
    .option('--json', 'print the report as JSON')
    .action(async (files: string[], flags: { json?: boolean }) => {
      const { checkConfigs } = await import('../../actions/check.js');
      const report = checkConfigs(files);
      if (flags.json) ctx.stdout(JSON.stringify(report, null, 2) + '\n');
      else {
        for (const f of report.files) if (f.valid && !report.issues.some((i) => i.file === f.file)) ctx.stdout(`${f.file}: ok (${f.kind})\n`);
        for (const i of report.issues) ctx.stdout(formatIssue(i) + '\n');
      }
      if (report.issues.length) throw new InputError(`${report.issues.length} problem${report.issues.length > 1 ? 's' : ''} found`, 'check-failed');
    });
}

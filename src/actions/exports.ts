import { InputError } from '../errors.js';
import type { MetricSettings } from '../metrics/evaluate.js';
import { anchorMapCsv, couplingTableCsv, hamiltonianCsv, siteTableCsv } from '../output/csv.js';
import { formatDesignFile } from '../output/design-file.js';
import { formatPdb } from '../output/pdb.js';
import type { DesignRecord } from '../output/record.js';
import { formatXyz } from '../output/xyz.js';
import { arraySvg } from '../report/array-svg.js';
import { levelsSvg } from '../report/levels-svg.js';
import type { ExportFormat } from './export-formats.js';

export { EXPORT_FORMATS, type ExportFormat } from './export-formats.js';

/** The text of a design in one export format; couplings use `system` (default: automatic dipole model, vacuum). */
export function exportDesign(r: DesignRecord, format: ExportFormat, system: MetricSettings['system'] = {}): string {
  switch (format) {
    case 'json': return formatDesignFile(r);
    case 'xyz': return formatXyz(r);
    case 'pdb': return formatPdb(r);
    case 'csv': return siteTableCsv(r);
    case 'hamiltonian': return hamiltonianCsv(r, system);
    case 'couplings': return couplingTableCsv(r, system);
    case 'svg-array': return arraySvg(r, { system });
    case 'svg-levels': return levelsSvg(r, { system });
    case 'anchors':
      if (!r.anchors) throw new InputError(`design '${r.name}' has no anchors: the anchor map is for lattice or anchor-list scaffolds`);
      return anchorMapCsv(r);
  }
}

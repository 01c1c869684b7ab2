import { InputError } from '../errors.js';
import type { MetricSettings } from '../metrics/evaluate.js';
import { designSystem } from '../metrics/evaluate.js';
import { anchorMapCsv, couplingTableCsv, hamiltonianCsv, siteTableCsv } from '../output/csv.js';
import { formatDesignFile } from '../output/design-file.js';
import { formatPdb } from '../output/pdb.js';
import type { DesignRecord } from '../output/record.js';
import { formatXyz } from '../output/xyz.js';

export const EXPORT_FORMATS = ['json', 'xyz', 'pdb', 'csv', 'hamiltonian', 'couplings', 'anchors'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

/** Coupling settings used when none are given: point or extended dipoles by distance, no screening. */
const DEFAULT_SYSTEM: MetricSettings['system'] = { couplingMethod: 'auto', screening: { kind: 'none' } };

/** The text of a design in one export format. */
export function exportDesign(r: DesignRecord, format: ExportFormat, system: MetricSettings['system'] = DEFAULT_SYSTEM): string {
  switch (format) {
    case 'json': return formatDesignFile(r);
    case 'xyz': return formatXyz(r);
    case 'pdb': return formatPdb(r);
    case 'csv': return siteTableCsv(r);
    case 'hamiltonian': return hamiltonianCsv(hamiltonianOf(r, system));
    case 'couplings': return couplingTableCsv(r, hamiltonianOf(r, system));
    case 'anchors':
      if (!r.anchors) throw new InputError(`design '${r.name}' has no anchors: the anchor map is for lattice or anchor-list scaffolds`);
      return anchorMapCsv(r);
  }
}

function hamiltonianOf(r: DesignRecord, system: MetricSettings['system']): number[][] {
  const sys = designSystem({ sites: r.sites, traps: r.traps }, { system } as MetricSettings);
  return Array.from({ length: sys.n }, (_, i) => Array.from(sys.hamiltonian.subarray(i * sys.n, (i + 1) * sys.n)));
}

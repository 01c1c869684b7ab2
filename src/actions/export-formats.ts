/** The formats of `lumenfold export` (a module of its own so that the CLI can list them without loading the formatters). */
export const EXPORT_FORMATS = ['json', 'xyz', 'pdb', 'csv', 'hamiltonian', 'couplings', 'anchors', 'svg-array', 'svg-levels'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

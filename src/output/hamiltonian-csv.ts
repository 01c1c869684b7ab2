/** The Hamiltonian of a design and its pairwise couplings as CSV. */
import { InputError } from '../errors.js';
import { formatMatrixCsv } from '../io/matrix-csv.js';
import { orientationFactor, unit } from '../physics/couplings.js';
import { buildSystem, type SystemOptions } from '../physics/hamiltonian.js';
import { requireNumber } from '../options.js';
import type { Vec3 } from '../physics/types.js';
import { formatCsv, type Cell } from './rfc4180.js';
import { designToJson } from './design-json.js';
import type { DesignRecord } from './record.js';

/** How couplings are computed (traps come from the record); the defaults of buildSystem otherwise. */
export type CouplingSettings = Partial<Omit<SystemOptions, 'traps'>>;

/** Significant digits of the Hamiltonian CSV (more than any coupling model is accurate to). */
export const HAMILTONIAN_DIGITS = 12;

export const COUPLING_TABLE_COLUMNS = ['i', 'j', 'distance_nm', 'kappa', 'coupling_cm'] as const;

/** A Hamiltonian given as rows (cm^-1), for callers that built it themselves. */
export type MatrixRows = ArrayLike<ArrayLike<number>>;

/** The Hamiltonian as one flat row-major array: built from the record with the settings, or checked when given. */
function hamiltonianOf(record: DesignRecord, source: CouplingSettings | MatrixRows): { n: number; H: Float64Array } {
  designToJson(record, { label: `Hamiltonian of "${String(record?.name)}"` });
  if (!Array.isArray(source)) {
    const sys = buildSystem(record.sites, { ...(source as CouplingSettings), traps: record.traps });
    return { n: sys.n, H: sys.hamiltonian };
  }
  return { n: record.sites.length, H: flatten(source, record.sites.length) };
}

/** Rows of a square matrix of order n, flattened; an InputError when it is not square or not finite. */
function flatten(rows: MatrixRows, n: number): Float64Array {
  if (rows.length !== n) throw new InputError(`the Hamiltonian has ${rows.length} rows but the design has ${n} sites`);
  const H = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    if (rows[i].length !== n) throw new InputError(`Hamiltonian row ${i + 1} has ${rows[i].length} entries, expected ${n}`);
    for (let j = 0; j < n; j++) H[i * n + j] = requireNumber(`Hamiltonian entry (${i + 1}, ${j + 1})`, rows[i][j]);
  }
  return H;
}

/**
 * The N x N Hamiltonian, cm^-1: comma separated, no header, one row per line, as `simulate --hamiltonian`
 * reads it. Either a matrix (rows) or a design with coupling settings (default: buildSystem's defaults).
 */
export function hamiltonianCsv(source: DesignRecord | MatrixRows, settings: CouplingSettings = {}): string {
  const { n, H } = Array.isArray(source) ? { n: source.length, H: flatten(source, source.length) } : hamiltonianOf(source as DesignRecord, settings);
  return formatMatrixCsv(Array.from({ length: n }, (_, i) => H.subarray(i * n, (i + 1) * n)), HAMILTONIAN_DIGITS);
}

/**
 * Every pair i < j (1-based): centre-to-centre distance (nm), orientation factor
 * kappa = u_i . u_j - 3 (u_i . r)(u_j . r) (CONVENTIONS.md), and the coupling the Hamiltonian holds (cm^-1,
 * with the chosen method, screening and overrides; or read from a Hamiltonian the caller gives).
 */
export function couplingTableCsv(record: DesignRecord, couplings: CouplingSettings | MatrixRows = {}): string {
  const { n, H } = hamiltonianOf(record, couplings);
  const u = record.sites.map((s, i) => unit(s.direction, `site ${i + 1} direction`));
  const rows: Cell[][] = [];
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const a = record.sites[i].position, b = record.sites[j].position;
      const d: Vec3 = [b[0] - a[0], b[1] - a[1], b[2] - a[2]];
      const R = Math.hypot(d[0], d[1], d[2]);
      const kappa = orientationFactor(u[i], u[j], [d[0] / R, d[1] / R, d[2] / R]);
      rows.push([i + 1, j + 1, R, kappa, H[i * n + j]]);
    }
  }
  return formatCsv(COUPLING_TABLE_COLUMNS, rows);
}

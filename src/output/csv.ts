/** The CSV exports in one place: RFC 4180 text, the site table, anchor map and ranking, the Hamiltonian and coupling table. */
export { csvField, formatCsv, parseCsv, type Cell } from './rfc4180.js';
export { ANCHOR_MAP_COLUMNS, SITE_TABLE_COLUMNS, anchorMapCsv, rankingCsv, siteTableCsv } from './tables.js';
export { COUPLING_TABLE_COLUMNS, HAMILTONIAN_DIGITS, couplingTableCsv, hamiltonianCsv, type CouplingSettings, type MatrixRows } from './hamiltonian-csv.js';

/** Output layer: the design file format, exports to XYZ, PDB and CSV, atomic writes and run folders. */
export * from './record.js';
export * from './design-error.js';
export { DESIGN_FORMAT, DESIGN_SCHEMA_PATH, compileDesignSchema, designSchema } from './design-schema.js';
export { designToJson, designFromJson, designIssues } from './design-json.js';
export { MAX_DESIGN_FILE_BYTES, formatDesignFile, parseDesignText, readDesignFile, writeDesignFile } from './design-file.js';
export { DEFAULT_HALF_LENGTH_NM, ELEMENTS, dyeAtoms, type DyeAtom, type DyeAtoms } from './dye-atoms.js';
export { ANGSTROM_PER_NM, XYZ_DECIMALS, formatXyz, parseXyz, type XyzAtom, type XyzFrame } from './xyz.js';
export { MAX_PDB_DYES, PDB_ENERGY_UNIT_CM, formatPdb } from './pdb.js';
export { parsePdb, type PdbAtom, type PdbFile, type PdbTer } from './pdb-parse.js';
export { RESERVED_RESIDUE_NAMES, baseResidueName, residueNames } from './residue-names.js';
export * from './csv.js';
export { LOCK_FILE, createRunFolder, writeFileAtomic, type RunFolder, type RunFolderOptions } from './atomic.js';
export { acquireLock, processAlive, type FolderLock } from './run-lock.js';

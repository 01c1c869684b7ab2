/**
 * The config layer: lumenfold's own file formats (constraint sets, dye palettes, objective recipes,
 * sweeps), their JSON Schemas, a strict loader for YAML and JSON, the checks that find configs no design
 * can satisfy, and the expansion of a sweep into self-contained jobs.
 */
export { scaffoldAnchors, type AnchorFrame, type AnchorPoint } from './anchors.js';
export { canonicalJson, contentHash } from './canonical-json.js';
export { checkConfigFiles, type CheckOptions, type CheckResult } from './check.js';
export { ConfigError, formatIssue, type ConfigIssue } from './config-error.js';
export * from './constraints-types.js';
export { MAX_DEPTH, MAX_FILE_BYTES, MAX_SWEEP_JOBS } from './limits.js';
export {
  inspectConfigFile,
  loadConfigFile,
  parseConfigText,
  validateConfigValue,
  type ConfigByKind,
  type Inspection,
  type ParseTextOptions,
  type ValidateOptions,
} from './load.js';
export * from './objective-types.js';
export { maxDyesInRegion } from './precheck/packing-bound.js';
export { precheck, precheckConstraints } from './precheck/precheck.js';
export type { PrecheckReason } from './precheck/reason.js';
export type { Syntax } from './read-text.js';
export { createAjv, FORMATS, schemaPath, type ConfigKind } from './schemas.js';
export { expandSweep, expandSweepChecked, inspectSweepJobs, loadSweepJobs, sweepBasePaths, type SweepBase } from './sweep.js';
export * from './sweep-types.js';

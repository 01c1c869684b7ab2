/**
 * `lumenfold report`: read a run folder, recompute what the report shows for the best design under the
 * run's own objective (disorder samples, population dynamics under each model), and write one
 * self-contained HTML file.
 */
import { existsSync, mkdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { formatIssue } from '../config/config-error.js';
import type { ConstraintSet } from '../config/constraints-types.js';
import { validateConfigValue, type ConfigByKind } from '../config/load.js';
import type { Objective } from '../config/objective-types.js';
import { InputError } from '../errors.js';
import { makeEnsemble, type DisorderModel } from '../metrics/disorder.js';
import { designSystem } from '../metrics/evaluate.js';
import { writeFileAtomic } from '../output/atomic.js';
import { formatPdb } from '../output/pdb.js';
import { evaluateTransport, type ModelName } from '../physics/transport.js';
import { reportContent } from '../report/content.js';
import { standaloneSvgs } from '../report/standalone.js';
import { modelDynamics } from '../report/dynamics.js';
import { reportLibraries } from '../report/libraries.js';
import { reportHtml, type ReportContent } from '../report/page.js';
import { disorderEfficiencies } from '../report/robustness.js';
import { readRunFolder, type RunFolderData } from '../report/run-folder.js';
import { maxSites, metricSettingsFrom } from './settings.js';
import { VERSION } from './version.js';

export interface ReportRequest {
  /** The run folder written by `lumenfold optimize`. */
  runFolder: string;
  /** Report file; default RUN_FOLDER/report.html. */
  out?: string;
  /** Overwrite an existing report (and existing SVG files). */
  force: boolean;
  /** Also write every picture and chart as a standalone SVG file into this folder. */
  svgFolder?: string;
}

export interface ReportSummary {
  format: 'lumenfold.report-summary/1';
  report: string;
  bytes: number;
  designs: number;
  /** Standalone SVG files written (with svgFolder). */
  svgFiles: string[];
  /** Parts of the report that could not be drawn, and why. */
  notes: string[];
}

/** The models whose population dynamics the report shows, in this order. */
export const REPORT_MODELS: readonly ModelName[] = ['hsr', 'redfield', 'forster'];

/** A config recorded in the manifest, validated again (defaults filled in) as the run used it. */
function recordedConfig<K extends 'constraints' | 'objective'>(run: RunFolderData, kind: K): ConfigByKind[K] {
  const file = `${join(run.folder, 'manifest.json')} (configs.${kind}.resolved)`;
  const r = validateConfigValue(structuredClone(run.manifest.configs[kind].resolved), kind, { file, baseDir: run.folder });
  if (r.issues.length > 0 || r.value === undefined) {
    throw new InputError(`the ${kind} recorded in the run is not valid: ${r.issues.length ? formatIssue(r.issues[0]) : file}`, 'run-incomplete');
  }
  return r.value;
}

/** The disorder model of an objective (the same mapping the run's metric settings use). */
function disorderModel(o: Objective): DisorderModel {
  const d = o.disorder;
  return { energySigma: d.energy_sigma, positionJitter: d.position_jitter, orientationJitter: d.orientation_jitter, samples: d.samples, seed: d.seed };
}

/** Write the HTML report of a run folder. */
export async function writeRunReport(req: ReportRequest): Promise<ReportSummary> {
  const folder = resolve(req.runFolder);
  const run = readRunFolder(folder);
  const out = resolve(req.out ?? join(folder, 'report.html'));
  if (existsSync(out) && !req.force) throw new InputError(`${out}: exists; use --force to overwrite the report`, 'exists');
  const constraints: ConstraintSet = recordedConfig(run, 'constraints');
  const objective = recordedConfig(run, 'objective');
  const best = run.designs[0].record;
  // the run drew its disorder for the constraint set's largest array: the same draws reproduce its robust metrics
  const sitesForDraws = Math.max(maxSites(constraints), best.sites.length);
  const settings = metricSettingsFrom(objective, sitesForDraws);
  const disorder = disorderModel(objective);
  const ensemble = settings.disorder ?? makeEnsemble(disorder, sitesForDraws);
  const notes: string[] = [];
  let pdb: string | { missing: string };
  try {
    pdb = formatPdb(best);
  } catch (e) {
    if (!(e instanceof InputError)) throw e;
    pdb = { missing: `No 3-D view: ${e.message}` };
    notes.push(pdb.missing);
  }
  const dynamics = REPORT_MODELS.map((m) => modelDynamics(best, settings, m));
  for (const d of dynamics) if (d.error) notes.push(`${d.model} dynamics: ${d.error}`);
  const content = reportContent({
    run,
    objective,
    settings,
    disorder,
    robustness: disorderEfficiencies(best, settings, ensemble),
    nominal: evaluateTransport(designSystem(best, settings), settings.transport).efficiency,
    dynamics,
    pdb,
    libraries: reportLibraries(),
    generated: new Date(),
    toolVersion: VERSION,
  });
  const svgFiles = req.svgFolder === undefined ? [] : await writeSvgs(resolve(req.svgFolder), content, req.force);
  const html = reportHtml(content);
  writeFileAtomic(out, html);
  return { format: 'lumenfold.report-summary/1', report: out, bytes: Buffer.byteLength(html), designs: run.designs.length, svgFiles, notes };
}

/** Write the standalone SVG files into a folder (created if needed); refuses to replace files unless forced. */
async function writeSvgs(folder: string, content: ReportContent, force: boolean): Promise<string[]> {
  const files = await standaloneSvgs(content);
  const paths = files.map((f) => join(folder, f.name));
  const present = paths.filter((p) => existsSync(p));
  if (present.length && !force) throw new InputError(`${present[0]}: exists; use --force to overwrite the SVG files`, 'exists');
  try {
    mkdirSync(folder, { recursive: true });
  } catch (e) {
    throw new InputError(`${folder}: cannot create the folder for the SVG files (${(e as NodeJS.ErrnoException).code ?? String(e)})`, 'write-failed');
  }
  files.forEach((f, k) => writeFileAtomic(paths[k], f.svg));
  return paths;
}

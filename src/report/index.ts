/** Pictures and the HTML run report. */
export { arraySvg, ARRAY_PICTURE_DEFAULTS, type ArrayPictureOptions } from './array-svg.js';
export { levelsSvg, COMPOSITION_LINE_WEIGHT, type LevelDiagramOptions } from './levels-svg.js';
export { bestFitPlane, projectDirection, projectPoint, type BestFitPlane } from './plane.js';
export { convergenceSpec, dynamicsSpec, frontSpec, robustnessSpec, type ChartLayout } from './charts.js';
export { chartSvg } from './chart-svg.js';
export { dynamicsData, frontData, type HistoryRow } from './chart-data.js';
export { disorderEfficiencies, type DisorderSamples } from './robustness.js';
export { modelDynamics, modelParameters, type ModelDynamics, type ModelParameter } from './dynamics.js';
export { readRunFolder, type RunFolderData, type RunManifest } from './run-folder.js';
export { reportHtml, type ReportContent } from './page.js';

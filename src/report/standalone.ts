/**
 * Every picture and chart of a report as standalone SVG files (no browser: the charts are rendered by
 * Vega's own SVG renderer in Node), named by their ids: picture-array.svg, chart-convergence.svg, ...
 */
import type { TopLevelSpec } from 'vega-lite';
import { chartSvg } from './chart-svg.js';
import type { ReportContent } from './page.js';

/** Width of a standalone chart, px (the report's charts fill their box instead). */
export const STANDALONE_CHART_WIDTH = 560;

export async function standaloneSvgs(c: ReportContent): Promise<{ name: string; svg: string }[]> {
  const out = c.pictures.map((p) => ({ name: `${p.id}.svg`, svg: p.svg }));
  for (const chart of [...c.searchCharts, ...c.dynamics]) {
    if (!chart.spec) continue;
    const { autosize: _fit, ...rest } = chart.spec as TopLevelSpec & { autosize?: unknown };
    const spec = { ...rest, width: STANDALONE_CHART_WIDTH, title: chart.heading } as TopLevelSpec;
    out.push({ name: `${chart.id}.svg`, svg: await chartSvg(spec) });
  }
  return out;
}

/** A Vega-Lite chart as standalone SVG text, rendered headless in Node by Vega's own SVG renderer (no browser). */
import { parse, View } from 'vega';
import { compile, type TopLevelSpec } from 'vega-lite';

export async function chartSvg(spec: TopLevelSpec): Promise<string> {
  const view = new View(parse(compile(spec).spec), { renderer: 'none' });
  try {
    return await view.toSVG();
  } finally {
    view.finalize();
  }
}

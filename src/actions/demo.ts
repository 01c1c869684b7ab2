import { fileURLToPath } from 'node:url';

/** The embedded demo scenario shipped with the package (invented dyes on a DNA-like two-helix scaffold). */
export const DEMO = {
  constraints: fileURLToPath(new URL('../../constraints/demo-helix.yaml', import.meta.url)),
  objective: fileURLToPath(new URL('../../objectives/demo-robust.yaml', import.meta.url)),
  sweep: fileURLToPath(new URL('../../sweeps/demo-temperature.yaml', import.meta.url)),
};

/** Shared helpers of the report tests: SVG read back by Python's XML parser, and point-dipole references in numpy. */
import { python } from '../search/helpers.js';

export interface SvgElement {
  tag: string;
  cls: string;
  data: Record<string, string>;
  text: string;
}

/**
 * Parse SVG text with Python's xml.etree.ElementTree (a parser outside the project: a document that is not
 * well-formed XML makes it fail) and list every element that has a class, with its data-* attributes and text.
 */
export function parseSvg(svg: string): { root: string; elements: SvgElement[] } {
  return python(
    `
import sys, json, xml.etree.ElementTree as ET
root = ET.fromstring(json.load(sys.stdin))
ns = '{http://www.w3.org/2000/svg}'
out = []
for e in root.iter():
    for c in (e.get('class') or '').split():
        out.append({'tag': e.tag.replace(ns, ''), 'cls': c, 'data': {k[5:]: v for k, v in e.attrib.items() if k.startswith('data-')}, 'text': ''.join(e.itertext())})
print(json.dumps({'root': root.tag.replace(ns, ''), 'elements': out}))
`,
    svg,
  );
}

export const byClass = (s: { elements: SvgElement[] }, cls: string) => s.elements.filter((e) => e.cls === cls);

/**
 * Point-dipole Hamiltonian (CONVENTIONS.md: J = 5.0341 kappa mu_m mu_n / R^3 cm^-1 with D and nm, vacuum; the prefactor
 * from the CODATA 2018 constants: 1 D = 1e-21 / c C m, eps0 = 8.8541878128e-12 F/m, h c = 1.98644586e-25 J m),
 * its eigenvalues (numpy.linalg.eigh) and the exciton dipole strengths |sum_m c_ma mu_m u_m|^2 relative to the
 * mean monomer strength, computed independently in numpy.
 */
export function numpyExcitons(sites: readonly { position: readonly number[]; direction: readonly number[]; dipole: number; energy: number }[]) {
  return python<{ H: number[][]; energies: number[]; strengths: number[] }>(
    `
import sys, json, numpy as np
s = json.load(sys.stdin)
n = len(s)
r = np.array([x['position'] for x in s], float)
u = np.array([x['direction'] for x in s], float); u /= np.linalg.norm(u, axis=1)[:, None]
mu = np.array([x['dipole'] for x in s], float)
c0 = 299792458.0; debye = 1e-21 / c0; eps0 = 8.8541878128e-12; hc_cm = 6.62607015e-34 * c0 * 100
pref = debye**2 / (4 * np.pi * eps0 * 1e-27) / hc_cm
H = np.diag([float(x['energy']) for x in s])
for i in range(n):
    for j in range(i + 1, n):
        d = r[j] - r[i]; R = np.linalg.norm(d); e = d / R
        kappa = u[i] @ u[j] - 3 * (u[i] @ e) * (u[j] @ e)
        H[i, j] = H[j, i] = pref * kappa * mu[i] * mu[j] / R**3
w, c = np.linalg.eigh(H)
m = mu[:, None] * u
f = np.array([np.sum((c[:, a] @ m) ** 2) for a in range(n)]) / np.mean(mu ** 2)
print(json.dumps({'H': H.tolist(), 'energies': w.tolist(), 'strengths': f.tolist()}))
`,
    sites,
  );
}

/** The accessible marks of a Vega SVG (parsed by Python's XML parser): each mark's role description and label. */
export function svgMarks(svg: string): { role: string; label: string }[] {
  return python(
    `
import sys, json, xml.etree.ElementTree as ET
root = ET.fromstring(json.load(sys.stdin))
print(json.dumps([{'role': e.get('aria-roledescription'), 'label': e.get('aria-label')} for e in root.iter() if e.get('aria-label') is not None]))
`,
    svg,
  );
}

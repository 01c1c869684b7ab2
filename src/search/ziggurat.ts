/**
 * Tables of the ziggurat method for standard normal deviates (Marsaglia and Tsang, "The ziggurat
 * method for generating random variables", J. Stat. Softw. 5(8), 2000): 128 layers of equal area
 * under exp(-x^2 / 2), right edge r = 3.442619855899, layer area v = 9.91256303526217e-3.
 * kn[i] is the acceptance threshold of layer i for a signed 32-bit integer, wn[i] its scale, fn[i]
 * the density at its edge. Layer 0 includes the tail beyond r.
 */
export const ZIGGURAT_R = 3.442619855899;
const V = 9.91256303526217e-3;
const M1 = 2147483648;

export const kn = new Int32Array(128);
export const wn = new Float64Array(128);
export const fn = new Float64Array(128);

(function setup() {
  let dn = ZIGGURAT_R;
  let tn = dn;
  const q = V / Math.exp(-0.5 * dn * dn);
  kn[0] = Math.floor((dn / q) * M1);
  kn[1] = 0;
  wn[0] = q / M1;
  wn[127] = dn / M1;
  fn[0] = 1;
  fn[127] = Math.exp(-0.5 * dn * dn);
  for (let i = 126; i >= 1; i--) {
    dn = Math.sqrt(-2 * Math.log(V / dn + Math.exp(-0.5 * dn * dn)));
    kn[i + 1] = Math.floor((dn / tn) * M1);
    tn = dn;
    fn[i] = Math.exp(-0.5 * dn * dn);
    wn[i] = dn / M1;
  }
})();

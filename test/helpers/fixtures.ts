/**
 * The 7-site bacteriochlorophyll Hamiltonian of Adolphs and Renger, Biophys. J. 91, 2778 (2006), in cm^-1
 * relative to 12210 cm^-1, as tabulated in QuTiP's HEOM tutorial (which cites Ishizaki and Fleming,
 * PNAS 106, 17255 (2009), who took it from Adolphs and Renger).
 */
export const ADOLPHS_RENGER_2006: number[][] = [
  [200, -87.7, 5.5, -5.9, 6.7, -13.7, -9.9],
  [-87.7, 320, 30.8, 8.2, 0.7, 11.8, 4.3],
  [5.5, 30.8, 0, -53.5, -2.2, -9.6, 6.0],
  [-5.9, 8.2, -53.5, 110, -70.7, -17.0, -63.3],
  [6.7, 0.7, -2.2, -70.7, 270, 81.1, -1.3],
  [-13.7, 11.8, -9.6, -17.0, 81.1, 420, 39.7],
  [-9.9, 4.3, 6.0, -63.3, -1.3, 39.7, 230],
];

/** Its eigenvalues, cm^-1 relative to 12210 (issue text; reproduced by numpy.linalg.eigvalsh). */
export const ADOLPHS_RENGER_2006_EIGENVALUES = [-30.01, 81.7, 155.09, 244.8, 259.67, 367.56, 471.2];

/**
 * Rec. ITU-R P.838-3 (03/2005), "Specific attenuation model for rain for use in
 * prediction methods", Tables 1-4: coefficients of
 *   log10 k = sum_j a_j exp(-((log10 f - b_j)/c_j)^2) + m log10 f + c0   (Eq. 2, Tables 1-2)
 *   alpha   = sum_j a_j exp(-((log10 f - b_j)/c_j)^2) + m log10 f + c0   (Eq. 3, Tables 3-4)
 * with f in GHz, k in (dB/km)/(mm/h)^alpha, alpha dimensionless.
 * Generated from test/reference/itu-r/p838-3_coefficients.csv (signs fixed against the
 * ITU-R SG3 validation workbook, see that README). Do not edit by hand.
 */

export interface P838Coefficients {
  readonly a: readonly number[];
  readonly b: readonly number[];
  readonly c: readonly number[];
  /** Slope of the linear term in log10 f. */
  readonly m: number;
  /** Constant term (the Recommendation's c_k / c_alpha). */
  readonly c0: number;
}

/** Table 1: k_H. */
export const P838_3_KH: P838Coefficients = {
  a: [-5.3398, -0.35351, -0.23789, -0.94158],
  b: [-0.10008, 1.2697, 0.86036, 0.64552],
  c: [1.13098, 0.454, 0.15354, 0.16817],
  m: -0.18961,
  c0: 0.71147,
};

/** Table 2: k_V. */
export const P838_3_KV: P838Coefficients = {
  a: [-3.80595, -3.44965, -0.39902, 0.50167],
  b: [0.56934, -0.22911, 0.73042, 1.07319],
  c: [0.81061, 0.51059, 0.11899, 0.27195],
  m: -0.16398,
  c0: 0.63297,
};

/** Table 3: alpha_H. */
export const P838_3_ALPHA_H: P838Coefficients = {
  a: [-0.14318, 0.29591, 0.32177, -5.3761, 16.1721],
  b: [1.82442, 0.77564, 0.63773, -0.9623, -3.2998],
  c: [-0.55187, 0.19822, 0.13164, 1.47828, 3.4399],
  m: 0.67849,
  c0: -1.95537,
};

/** Table 4: alpha_V. */
export const P838_3_ALPHA_V: P838Coefficients = {
  a: [-0.07771, 0.56727, -0.20238, -48.2991, 48.5833],
  b: [2.3384, 0.95545, 1.1452, 0.791669, 0.791459],
  c: [-0.76284, 0.54039, 0.26809, 0.116226, 0.116479],
  m: -0.053739,
  c0: 0.83433,
};

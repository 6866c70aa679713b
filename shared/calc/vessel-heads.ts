/**
 * Outer surface areas of vessel heads.
 *
 * References:
 * 1. W. H. Beyer (ed.), *CRC Standard Mathematical Tables*, 28th ed., CRC Press, 1987 — surface of an
 *    oblate spheroid S = 2πa² + (πc²/e)·ln[(1 + e)/(1 − e)], e² = 1 − c²/a².
 * 2. ASME Boiler and Pressure Vessel Code, Section VIII Div. 1, UG-32 — 2:1 ellipsoidal head: depth D/4.
 */

export type HeadType = 'flat' | 'ellipsoidal2to1' | 'hemispherical';

/**
 * Area of half an oblate spheroid (one head) with semi-axes a (equatorial) ≥ c (polar):
 * S/2 = π·a²·[1 + (1 − e²)/e·artanh(e)], e = √(1 − c²/a²).
 *
 * @param a - equatorial semi-axis [m]
 * @param c - polar semi-axis (head depth) [m], c ≤ a
 * @returns area of the curved half surface [m²]
 * @remarks Exact; tends to the hemisphere 2πa² as c → a.
 * @example
 * // 2:1 ellipsoidal head, D = 1 m: a = 0.5, c = 0.25 → 1.084 m²
 * halfOblateSpheroidArea(0.5, 0.25); // ≈ 1.0840
 *
 * References: [1].
 */
export function halfOblateSpheroidArea(a: number, c: number): number {
  const e2 = 1 - (c * c) / (a * a);
  if (e2 < 1e-10) return 2 * Math.PI * a * a;
  const e = Math.sqrt(e2);
  return Math.PI * a * a * (1 + ((1 - e2) / e) * Math.atanh(e));
}

/**
 * Outer area of one head of a vessel with shell diameter D, after an insulation of thickness t:
 * flat πD²/4; hemispherical 2π(D/2 + t)²; 2:1 ellipsoidal half oblate spheroid with semi-axes
 * (D/2 + t, D/4 + t).
 *
 * @param headType - 'flat' | 'ellipsoidal2to1' | 'hemispherical'
 * @param diameterM - shell outside diameter D [m]
 * @param offsetM - insulation thickness over the head [m] (0 for the bare head)
 * @returns area [m²]
 * @remarks A flat head's insulation is treated as a slab of the head's own area; an offset ellipsoid is
 * approximated by the ellipsoid with both semi-axes grown by t (exact for t = 0).
 * @example
 * headArea('ellipsoidal2to1', 2, 0); // ≈ 1.084·2² = 4.336
 *
 * References: [1], [2].
 */
export function headArea(headType: HeadType, diameterM: number, offsetM: number): number {
  const r = diameterM / 2;
  switch (headType) {
    case 'flat':
      return Math.PI * r * r;
    case 'hemispherical':
      return 2 * Math.PI * (r + offsetM) * (r + offsetM);
    case 'ellipsoidal2to1':
      return halfOblateSpheroidArea(r + offsetM, r / 2 + offsetM);
  }
}

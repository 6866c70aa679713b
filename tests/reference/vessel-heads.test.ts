import { headArea, halfOblateSpheroidArea } from '../../shared/calc';

/**
 * Independent area of a surface of revolution by Simpson quadrature of A = 2π ∫ x ds along the
 * meridian of the ellipse x = a·cos φ, y = c·sin φ, φ ∈ [0, π/2]
 * (Source: G. B. Thomas, *Calculus*, any edition, "Areas of surfaces of revolution": S = 2π∫ y ds).
 */
function surfaceOfRevolutionQuadrature(a: number, c: number): number {
  // Composite Simpson over 2000 panels: error far below 1e-9 for this smooth meridian.
  const n = 2000;
  const h = Math.PI / 2 / n;
  let s = 0;
  for (let i = 0; i <= n; i++) {
    const phi = i * h;
    const x = a * Math.cos(phi);
    const ds = Math.sqrt(a * a * Math.sin(phi) ** 2 + c * c * Math.cos(phi) ** 2);
    const w = i === 0 || i === n ? 1 : i % 2 === 1 ? 4 : 2;
    s += w * x * ds;
  }
  return 2 * Math.PI * s * (h / 3);
}

describe('vessel head outer areas', () => {
  it('when the head is 2:1 ellipsoidal, then the exact formula matches a numerical surface integral', () => {
    // Source: W. H. Beyer (ed.), CRC Standard Mathematical Tables, 28th ed., oblate spheroid surface; checked
    // here against direct quadrature of 2π∫x ds (independent of the closed form). Tolerance 1e-7 relative.
    for (const D of [0.5, 1, 2.4, 6]) {
      const expected = surfaceOfRevolutionQuadrature(D / 2, D / 4);
      expect(Math.abs(headArea('ellipsoidal2to1', D, 0) / expected - 1)).toBeLessThan(1e-7);
    }
  });

  it('when the head is 2:1 ellipsoidal, then its area is 1.084·D²', () => {
    // Source: common practice (vessel-fabrication tables quote the 2:1 semi-ellipsoidal head surface as
    // 1.084·D², 4 significant figures → tolerance 0.05 %).
    expect(Math.abs(headArea('ellipsoidal2to1', 1, 0) - 1.084)).toBeLessThan(0.0005);
  });

  it('when the head is hemispherical, then its area is 2π r² of the insulated radius', () => {
    // Source: Beyer, CRC Standard Mathematical Tables, 28th ed., sphere surface 4πr² (half for a head).
    const D = 1.8;
    const t = 0.05;
    expect(headArea('hemispherical', D, t)).toBeCloseTo(2 * Math.PI * (D / 2 + t) ** 2, 10);
    // The spheroid formula tends to the hemisphere as the axes become equal.
    expect(halfOblateSpheroidArea(1, 0.9999999)).toBeCloseTo(2 * Math.PI, 5);
  });

  it('when an insulated ellipsoidal head is offset by t, then the area is that of the grown spheroid', () => {
    // Source: quadrature as above with semi-axes (D/2 + t, D/4 + t).
    const D = 2;
    const t = 0.1;
    const expected = surfaceOfRevolutionQuadrature(D / 2 + t, D / 4 + t);
    expect(Math.abs(headArea('ellipsoidal2to1', D, t) / expected - 1)).toBeLessThan(1e-7);
  });

  it('when the head is flat, then its area is the disc πD²/4', () => {
    // Source: Beyer, CRC Standard Mathematical Tables, circle area.
    expect(headArea('flat', 3, 0.1)).toBeCloseTo((Math.PI * 9) / 4, 10);
  });
});

// Reactions of a rigid base on four supports of equal stiffness, with lift-off (statics, common
// practice, no source): used by the stability check (tipping, backward stability) and by the
// ground-bearing check (support forces and pressures).

/** Four-support reactions about the box centre; order right front, left front, left rear, right rear. */
export function fourSupportReactions(V: number, ex: number, ey: number, a: number, b: number): number[] {
  const sx = [-1, -1, 1, 1];
  const sy = [-1, 1, 1, -1];
  const out = [0, 0, 0, 0];
  for (let i = 0; i < 4; i++) out[i] = V / 4 + (V * ex * sx[i]) / (4 * a) + (V * ey * sy[i]) / (4 * b);
  return out;
}

/** Reactions with support `off` lifted: three-support statics (ΣV, ΣM about both axes). */
export function threeSupportReactions(
  V: number,
  ex: number,
  ey: number,
  a: number,
  b: number,
  off: number,
): number[] {
  const px = [-a, -a, a, a];
  const py = [-b, b, b, -b];
  const idx = [0, 1, 2, 3].filter((i) => i !== off);
  const [i, j, k] = idx;
  // [1 1 1; x_i x_j x_k; y_i y_j y_k] R = [V, V ex, V ey]
  const m = [
    [1, 1, 1],
    [px[i], px[j], px[k]],
    [py[i], py[j], py[k]],
  ];
  const rhs = [V, V * ex, V * ey];
  const det3 = (q: number[][]) =>
    q[0][0] * (q[1][1] * q[2][2] - q[1][2] * q[2][1]) -
    q[0][1] * (q[1][0] * q[2][2] - q[1][2] * q[2][0]) +
    q[0][2] * (q[1][0] * q[2][1] - q[1][1] * q[2][0]);
  const D = det3(m);
  const out = [0, 0, 0, 0];
  for (let c = 0; c < 3; c++) {
    const mc = m.map((row, r) => row.map((v, cc) => (cc === c ? rhs[r] : v)));
    out[idx[c]] = det3(mc) / D;
  }
  return out;
}

/**
 * Four-support reactions of a rigid base with lift-off (order right front, left front, left rear,
 * right rear); null when no set of compressive reactions balances it (the resultant is outside).
 */
export function supportReactions(V: number, ex: number, ey: number, a: number, b: number): number[] | null {
  if (Math.abs(ex) > a * (1 + 1e-12) || Math.abs(ey) > b * (1 + 1e-12)) return null;
  let R = fourSupportReactions(V, ex, ey, a, b);
  let minI = 0;
  for (let i = 1; i < 4; i++) if (R[i] < R[minI]) minI = i;
  if (R[minI] < 0) {
    R = threeSupportReactions(V, ex, ey, a, b, minI);
    // a resultant right on the diagonal: the fourth reaction is round-off; never report a pull
    for (let i = 0; i < 4; i++) if (R[i] < 0) R[i] = 0;
  }
  return R;
}

// The revision-cloud outline drawn by the review workspace (SVG) and burned into the
// stamped return (pdf-lib), from one function so both draw the same arcs.

/**
 * A scalloped outline round a box as an SVG path (y down, origin at the box's top-left),
 * in the box's own units: arcs bulging outwards along each edge, clockwise on paper.
 */
export function cloudPath(width: number, height: number): string {
  const bump = Math.max(6, Math.min(14, Math.min(width, height) / 3));
  const corners: [number, number][] = [
    [0, 0],
    [width, 0],
    [width, height],
    [0, height],
  ];
  let d = 'M0 0';
  for (let i = 0; i < 4; i++) {
    const [x0, y0] = corners[i];
    const [x1, y1] = corners[(i + 1) % 4];
    const len = Math.hypot(x1 - x0, y1 - y0);
    const n = Math.max(2, Math.round(len / (bump * 1.6)));
    const r = len / n / 2;
    for (let k = 1; k <= n; k++) {
      const px = x0 + ((x1 - x0) * k) / n;
      const py = y0 + ((y1 - y0) * k) / n;
      d += ` A${r.toFixed(2)} ${r.toFixed(2)} 0 0 1 ${px.toFixed(2)} ${py.toFixed(2)}`;
    }
  }
  return `${d} Z`;
}

import { px } from './svg-text.js';

/**
 * SVG path data through the points in order, lifting the pen at every missing y so gaps stay
 * gaps (a line never bridges a missing bin). Returns '' when no point has a y.
 */
export function linePath(points: readonly { x: number; y: number | undefined }[]): string {
  const out: string[] = [];
  let pen = false;
  for (const p of points) {
    if (p.y === undefined || !Number.isFinite(p.y)) {
      pen = false;
      continue;
    }
    out.push(`${pen ? 'L' : 'M'}${px(p.x)} ${px(p.y)}`);
    pen = true;
  }
  return out.join('');
}

import type { ProjectionContent } from '../bundle-content';
import { escapeHtml } from './html';

const WIDTH = 640;
const HEIGHT = 480;
const MARGIN = { left: 64, right: 160, top: 16, bottom: 48 };
/** Our own palette, chosen to stay distinguishable in print and for common colour-vision deficiencies. */
const PALETTE = ['#1b6ca8', '#d1495b', '#2e8b57', '#8e5ea2', '#e08e0b', '#00798c', '#6d597a', '#a05a2c'];
const UNKNOWN_COLOUR = '#222222';

/** About five round tick values covering [min, max] (steps of 1, 2 or 5 times a power of ten). */
function tickValues(min: number, max: number): number[] {
  const span = max - min;
  const raw = span / 5;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * power).find((s) => s >= raw) ?? 10 * power;
  const ticks: number[] = [];
  for (let t = Math.ceil(min / step) * step; t <= max + step * 1e-9; t += step) ticks.push(Number(t.toPrecision(12)));
  return ticks;
}

function extent(values: number[]): [number, number] {
  let min = Math.min(...values);
  let max = Math.max(...values);
  if (min === max) {
    min -= 1;
    max += 1;
  }
  const pad = (max - min) * 0.05;
  return [min - pad, max + pad];
}

/**
 * The projection as inline SVG: reference members as filled circles in their group's colour, unknowns
 * as dark crosses, each group's confidence ellipse as an outline. Drawn here so the report needs no script.
 */
export function scatterSvg(projection: ProjectionContent, groupNames: readonly string[]): string {
  const colour = new Map(groupNames.map((name, k) => [name, PALETTE[k % PALETTE.length]]));
  const xs = [...projection.points.map((p) => p.x), ...projection.ellipses.flatMap((e) => e.x)];
  const ys = [...projection.points.map((p) => p.y), ...projection.ellipses.flatMap((e) => e.y)];
  const [x0, x1] = extent(xs);
  const [y0, y1] = extent(ys);
  const plotW = WIDTH - MARGIN.left - MARGIN.right;
  const plotH = HEIGHT - MARGIN.top - MARGIN.bottom;
  const sx = (x: number) => MARGIN.left + ((x - x0) / (x1 - x0)) * plotW;
  const sy = (y: number) => MARGIN.top + plotH - ((y - y0) / (y1 - y0)) * plotH;
  const r = (v: number) => v.toFixed(2);

  const parts: string[] = [];
  // Tick values are already round; the three-digit reader format would turn a tick at 10250 into 10300.
  for (const t of tickValues(x0, x1)) {
    parts.push(`<line x1="${r(sx(t))}" x2="${r(sx(t))}" y1="${MARGIN.top}" y2="${MARGIN.top + plotH}" class="grid"/>`);
    parts.push(`<text x="${r(sx(t))}" y="${MARGIN.top + plotH + 16}" text-anchor="middle">${t}</text>`);
  }
  for (const t of tickValues(y0, y1)) {
    parts.push(
      `<line x1="${MARGIN.left}" x2="${MARGIN.left + plotW}" y1="${r(sy(t))}" y2="${r(sy(t))}" class="grid"/>`,
    );
    parts.push(`<text x="${MARGIN.left - 6}" y="${r(sy(t) + 4)}" text-anchor="end">${t}</text>`);
  }
  parts.push(`<rect x="${MARGIN.left}" y="${MARGIN.top}" width="${plotW}" height="${plotH}" class="frame"/>`);
  for (const ellipse of projection.ellipses) {
    const points = ellipse.x.map((x, i) => `${r(sx(x))},${r(sy(ellipse.y[i]))}`).join(' ');
    parts.push(
      `<polygon points="${points}" fill="none" stroke="${colour.get(ellipse.group) ?? UNKNOWN_COLOUR}" stroke-width="1.5"/>`,
    );
  }
  for (const point of projection.points) {
    const title = `<title>${escapeHtml(point.sampleId)}${point.group ? ` (${escapeHtml(point.group)})` : ''}</title>`;
    const [cx, cy] = [sx(point.x), sy(point.y)];
    if (point.role === 'reference') {
      parts.push(
        `<circle cx="${r(cx)}" cy="${r(cy)}" r="3.5" fill="${colour.get(point.group ?? '') ?? UNKNOWN_COLOUR}" fill-opacity="0.75">${title}</circle>`,
      );
    } else {
      const d = `M${r(cx - 4)},${r(cy - 4)}L${r(cx + 4)},${r(cy + 4)}M${r(cx - 4)},${r(cy + 4)}L${r(cx + 4)},${r(cy - 4)}`;
      parts.push(`<path d="${d}" stroke="${UNKNOWN_COLOUR}" stroke-width="1.5">${title}</path>`);
    }
  }
  const legendX = MARGIN.left + plotW + 16;
  groupNames.forEach((name, k) => {
    const y = MARGIN.top + 12 + k * 18;
    parts.push(
      `<circle cx="${legendX}" cy="${y - 4}" r="4" fill="${colour.get(name)}"/><text x="${legendX + 10}" y="${y}">${escapeHtml(name)}</text>`,
    );
  });
  const unknownY = MARGIN.top + 12 + groupNames.length * 18;
  parts.push(
    `<path d="M${legendX - 4},${unknownY - 8}L${legendX + 4},${unknownY}M${legendX - 4},${unknownY}L${legendX + 4},${unknownY - 8}" stroke="${UNKNOWN_COLOUR}" stroke-width="1.5"/><text x="${legendX + 10}" y="${unknownY}">unknown sample</text>`,
  );
  parts.push(
    `<text x="${MARGIN.left + plotW / 2}" y="${HEIGHT - 8}" text-anchor="middle">${escapeHtml(projection.xLabel)}</text>`,
  );
  parts.push(
    `<text transform="translate(16 ${MARGIN.top + plotH / 2}) rotate(-90)" text-anchor="middle">${escapeHtml(projection.yLabel)}</text>`,
  );
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${WIDTH} ${HEIGHT}" role="img" aria-label="${escapeHtml(projection.title)}">${parts.join('')}</svg>`;
}

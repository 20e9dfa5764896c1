/**
 * The shop's chart preview: a deliberately coarse picture of the released
 * chart, never the pattern itself. The first size's chart is cut into
 * square blocks of at least 2 x 2 stitches (more for large charts, so the
 * picture is at most 24 blocks across), each block filled with its most
 * common yarn colour. No symbols, no text, no counts, no source: enough to
 * see the motif's colours and shape, not enough to knit from.
 */
import { compile } from '../../shared/index.ts';
import { buildChart } from '../../shared/render/index.ts';

/** Most blocks across or up the preview. */
export const PREVIEW_MAX_BLOCKS = 24;
/** Smallest block, in stitches per side. */
export const PREVIEW_MIN_BLOCK = 2;
const CELL_PX = 10;

const cache = new Map<string, string>();

/** A neutral picture for a pattern without a chart to show. */
function placeholderSvg(): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 120 120" width="120" height="120" role="img" aria-label="No chart preview"><rect width="120" height="120" fill="#efe9dd"/><path d="M20 90 L50 50 L70 75 L85 60 L100 90 Z" fill="#d8cfbd"/></svg>`;
}

/**
 * The preview SVG of `source` (the released revision). Cached by `key`
 * (pattern id and revision number), since released revisions never change.
 */
export function chartPreviewSvg(key: string, source: string): string {
  const hit = cache.get(key);
  if (hit) return hit;
  const chart = buildChart(compile(source));
  let svg = placeholderSvg();
  if (chart && chart.width > 0 && chart.rows.length > 0) {
    const block = Math.max(PREVIEW_MIN_BLOCK, Math.ceil(chart.width / PREVIEW_MAX_BLOCKS), Math.ceil(chart.rows.length / PREVIEW_MAX_BLOCKS));
    const across = Math.ceil(chart.width / block);
    const up = Math.min(PREVIEW_MAX_BLOCKS, Math.ceil(chart.rows.length / block));
    const rects: string[] = [];
    for (let by = 0; by < up; by++) {
      for (let bx = 0; bx < across; bx++) {
        const counts = new Map<string, number>();
        for (let r = by * block; r < Math.min(chart.rows.length, (by + 1) * block); r++) {
          const cells = chart.rows[r]!.cells;
          for (let x = bx * block; x < Math.min(chart.width, (bx + 1) * block); x++) {
            const cell = cells[x];
            if (cell && !cell.isBoundOff) counts.set(cell.colour, (counts.get(cell.colour) ?? 0) + 1);
          }
        }
        let best: string | null = null;
        let bestCount = 0;
        for (const [colour, n] of counts) if (n > bestCount || (n === bestCount && best !== null && colour < best)) { best = colour; bestCount = n; }
        // Round 1 is drawn at the bottom, as charts are read.
        if (best && /^#[0-9a-fA-F]{6}$/.test(best)) rects.push(`<rect x="${bx * CELL_PX}" y="${(up - 1 - by) * CELL_PX}" width="${CELL_PX}" height="${CELL_PX}" fill="${best}"/>`);
      }
    }
    const w = across * CELL_PX;
    const h = up * CELL_PX;
    svg = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${w} ${h}" width="${w}" height="${h}" role="img" aria-label="Coarse chart preview" shape-rendering="crispEdges"><rect width="${w}" height="${h}" fill="#efe9dd"/>${rects.join('')}</svg>`;
  }
  if (cache.size > 500) cache.clear();
  cache.set(key, svg);
  return svg;
}

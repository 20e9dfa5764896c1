/**
 * Pure parts of the exports: the chart page plan (every part of the chart
 * lands on some page, at a legible scale) and the WOFF-to-sfnt unpacking of
 * the shipped fonts for the PNG rasteriser, checked against the OpenType
 * table-directory rules (table checksums: the sum of big-endian uint32 words
 * of the zero-padded table, OpenType specification, "Calculating checksums").
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { woffPath, woffToSfnt, type FontRole } from '../../server/services/exports/fonts.ts';
import { MIN_CHART_SCALE, planChartPages } from '../../server/services/exports/pdf.ts';

describe('chart page plan', () => {
  it('puts a small chart whole on one page, never enlarged', () => {
    const plan = planChartPages(200, 150);
    expect(plan.tiles).toEqual([{ x: 0, y: 0 }]);
    expect(plan.scale).toBe(1);
  });

  it('covers every point of a big chart with some page, at the smallest legible scale or larger', () => {
    for (const [w, h] of [[3160, 1036], [1320, 1249], [900, 4000], [5000, 5000]] as const) {
      const plan = planChartPages(w, h);
      expect(plan.scale).toBeGreaterThanOrEqual(MIN_CHART_SCALE);
      const pageW = (plan.layout === 'portrait' ? 595.28 : 841.89) - 100;
      // Sample the chart on a grid and find a page part holding each point.
      const tileW = pageW / plan.scale;
      for (let x = 0; x <= w; x += w / 37) {
        for (let y = 0; y <= h; y += h / 29) {
          const holder = plan.tiles.find((t) => x >= t.x - 1e-6 && x <= t.x + tileW + 1e-6 && y >= t.y - 1e-6);
          expect(holder, `${w}x${h} point ${x},${y}`).toBeDefined();
        }
      }
      // The first part starts at the right edge (rounds are read from the right).
      expect(plan.tiles[0]!.x + tileW).toBeGreaterThanOrEqual(w - 1e-6);
    }
  });
});

describe('shipped fonts unpacked for the rasteriser', () => {
  for (const role of ['regular', 'bold', 'mono'] as FontRole[]) {
    it(`${role}: an sfnt whose tables match the WOFF directory's checksums`, () => {
      const woff = readFileSync(woffPath(role));
      const sfnt = woffToSfnt(woff);
      const numTables = sfnt.readUInt16BE(4);
      expect(numTables).toBe(woff.readUInt16BE(12));
      expect(sfnt.readUInt32BE(0)).toBe(woff.readUInt32BE(4)); // flavor carried over
      const tags: string[] = [];
      for (let i = 0; i < numTables; i++) {
        const rec = 12 + i * 16;
        const tag = sfnt.subarray(rec, rec + 4).toString('latin1');
        tags.push(tag);
        const offset = sfnt.readUInt32BE(rec + 8), length = sfnt.readUInt32BE(rec + 12);
        expect(offset % 4, tag).toBe(0);
        if (tag === 'head') continue; // its checksum is computed with checkSumAdjustment zeroed
        let sum = 0;
        for (let o = offset; o < offset + length; o += 4) {
          const word = Buffer.alloc(4);
          sfnt.copy(word, 0, o, Math.min(o + 4, offset + length));
          sum = (sum + word.readUInt32BE(0)) >>> 0;
        }
        expect(sum, tag).toBe(sfnt.readUInt32BE(rec + 4));
      }
      expect([...tags].sort()).toEqual(tags);
      for (const needed of ['cmap', 'glyf', 'head', 'hmtx', 'name']) expect(tags).toContain(needed);
    });
  }
});

/**
 * The golden cases of the renderers: every demo pattern (examples/*.loop)
 * and every size, front chart, back of the work and written instructions.
 * Shared by the golden test and the script that writes the files
 * (tests/shared/render/update-golden.ts).
 */
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { compile } from '../../../shared/index.ts';
import { buildChart, formatInstructionsText, renderBackSvg, renderChartSvg, writeInstructions } from '../../../shared/render/index.ts';

export const EXAMPLES_DIR = join(import.meta.dirname, '../../../examples');
export const GOLDEN_DIR = join(import.meta.dirname, 'golden');

/** One golden file: its name and how to make its text. */
export interface GoldenCase { file: string; make: () => string }

/** The demo pattern files (the broken/ fixtures are not demos). */
export function demoFiles(): string[] {
  return readdirSync(EXAMPLES_DIR).filter((f) => f.endsWith('.loop')).sort();
}

/** Size names as file-name parts ("one size" -> "one-size"). */
function slug(size: string): string {
  return size.replace(/[^A-Za-z0-9]+/g, '-');
}

/** Every golden case. */
export function goldenCases(): GoldenCase[] {
  const cases: GoldenCase[] = [];
  for (const f of demoFiles()) {
    const source = readFileSync(join(EXAMPLES_DIR, f), 'utf8');
    const result = compile(source);
    const base = f.replace(/\.loop$/, '');
    for (const size of result.sizes) {
      const name = `${base}.${slug(size.name)}`;
      cases.push({ file: `${name}.front.svg`, make: () => renderChartSvg(buildChart(result, size.name)!) });
      cases.push({ file: `${name}.back.svg`, make: () => renderBackSvg(buildChart(result, size.name)!) });
      cases.push({ file: `${name}.instructions.txt`, make: () => formatInstructionsText(writeInstructions(source, result, size.name)!) });
    }
  }
  return cases;
}

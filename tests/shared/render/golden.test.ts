/**
 * Golden files: the chart (front and back) and the written instructions of
 * every demo pattern and size, reviewed like code. Regenerate with
 * `npx tsx tests/shared/render/update-golden.ts` after a deliberate change.
 */
import { readFileSync, existsSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { XMLValidator } from 'fast-xml-parser';
import { GOLDEN_DIR, demoFiles, goldenCases } from './golden-cases.ts';

describe('renderer golden files', () => {
  it('there are demo patterns to render', () => {
    expect(demoFiles().length).toBeGreaterThanOrEqual(3);
  });
  for (const c of goldenCases()) {
    it(`${c.file} matches its golden file`, () => {
      const path = join(GOLDEN_DIR, c.file);
      expect(existsSync(path), `missing golden file ${c.file}: run tests/shared/render/update-golden.ts`).toBe(true);
      const text = c.make();
      if (c.file.endsWith('.svg')) expect(XMLValidator.validate(text)).toBe(true);
      // Compared as a whole; on a mismatch show where it starts rather than megabytes of SVG.
      const golden = readFileSync(path, 'utf8');
      if (text !== golden) {
        let i = 0;
        while (i < text.length && text[i] === golden[i]) i++;
        expect(text.slice(Math.max(0, i - 80), i + 160)).toBe(golden.slice(Math.max(0, i - 80), i + 160));
      }
      expect(text.length).toBe(golden.length);
    });
  }
});

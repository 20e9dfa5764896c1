/**
 * Golden diagnostics: every fixture in examples/broken shows the code in its
 * name, and its rendered diagnostics are pinned in tests/shared/golden.
 * Every code in the catalogue has a fixture and a paragraph in
 * grammar/diagnostics.md.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { CODE_LIST, formatDiagnosticText } from '../../shared/index.ts';
import { brokenFixtures, compileFixture, root } from './fixtures.ts';

const fixtures = brokenFixtures();

describe('broken examples', () => {
  for (const f of fixtures) {
    it(`${f.file} reports ${f.code}, as in its golden file`, async () => {
      const r = compileFixture(f.source);
      expect(r.diagnostics.map((d) => d.code)).toContain(f.code);
      const text = r.diagnostics.map((d) => formatDiagnosticText(d, f.file)).join('\n') + '\n';
      await expect(text).toMatchFileSnapshot(path.join('golden', f.file.replace(/\.loop$/, '.txt')));
    });
  }

  it('every diagnostic code has a fixture', () => {
    const covered = new Set(fixtures.map((f) => f.code));
    expect(CODE_LIST.map((c) => c.code).filter((c) => !covered.has(c))).toEqual([]);
  });

  it('every diagnostic code has a section in grammar/diagnostics.md', () => {
    const doc = readFileSync(path.join(root, 'grammar', 'diagnostics.md'), 'utf8');
    expect(CODE_LIST.map((c) => c.code).filter((c) => !doc.includes(`## ${c}`))).toEqual([]);
  });

  it('a fixture that shows one problem shows only that code (follow-on problems are suppressed)', () => {
    const noisy = fixtures
      .filter((f) => !['LW902', 'LW208'].includes(f.code))
      .filter((f) => new Set(compileFixture(f.source).diagnostics.map((d) => d.code)).size !== 1)
      .map((f) => f.file);
    expect(noisy).toEqual([]);
  });

  it('messages name the size and both numbers (notation.md example wording)', () => {
    const src = 'sizes S M\nyarn A "Harbour" #1d3557\ncast on 60/60\nround 1: k to end\nround 2: k 58/60';
    const r = compileFixture(src);
    expect(r.diagnostics).toHaveLength(1);
    expect(r.diagnostics[0]).toMatchObject({ code: 'LW301', severity: 'error', size: 'S', message: 'round 2 works 58 stitches but 60 are on the needle (size S)' });
    expect(r.diagnostics[0].hint).toBe('work 2 more stitches, or end with "k to end"');
  });

  it('one typo does not hide the next problem (parser recovery)', () => {
    const src = 'yarn A "Harbour" #1d3557\ncast on 40\nround 1 k to end\nround 2: k 38\nround 3: k to end in Q';
    const r = compileFixture(src);
    expect(r.diagnostics.map((d) => [d.code, d.span.line])).toEqual([['LW102', 3], ['LW301', 4], ['LW202', 5]]);
  });
});

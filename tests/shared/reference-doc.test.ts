/**
 * grammar/reference.md stays true to the grammar: every ```loop example in
 * it reads without a syntax problem (LW101/LW102), and the first one, a
 * complete pattern, compiles without errors.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { compile } from '../../shared/index.ts';
import { parseSource } from '../../shared/notation/index.ts';
import { root } from './fixtures.ts';

const doc = readFileSync(path.join(root, 'grammar', 'reference.md'), 'utf8');
const blocks = [...doc.matchAll(/```loop\n([\s\S]*?)```/g)].map((m) => m[1]);

describe('grammar/reference.md examples', () => {
  it('has examples', () => {
    expect(blocks.length).toBeGreaterThan(10);
  });

  blocks.forEach((block, i) => {
    it(`example ${i + 1} reads without syntax problems: ${block.split('\n')[0].slice(0, 50)}`, () => {
      const syntax = parseSource(block).diagnostics.filter((d) => d.code === 'LW101' || d.code === 'LW102');
      expect(syntax.map((d) => `${d.span.line}: ${d.message}`)).toEqual([]);
    });
  });

  it('the opening example is a complete pattern without errors', () => {
    const r = compile(blocks[0]);
    expect(r.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
    expect(r.sizes.map((s) => s.name)).toEqual(['S', 'M', 'L']);
  });
});

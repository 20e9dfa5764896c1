/**
 * The checker's diagnostics sink (shared/check/context.ts): one report per
 * code, place, size and key, and a cheap answer for repeats so an operation
 * that meets the same problem on each of a million repeat passes does not
 * build a million facts objects (found by `npm run fuzz`).
 */
import { describe, expect, it } from 'vitest';
import { Reporter } from '../../shared/check/context.ts';
import { compile } from '../../shared/index.ts';

const span = (from: number, to: number) => ({ from, to, line: 1, column: from + 1, endLine: 1, endColumn: to + 1 });

describe('Reporter', () => {
  it('keeps the first report per code, place, size and key, and counts every call', () => {
    const r = new Reporter();
    const a = span(0, 3);
    expect(r.report('LW405', a, { detail: 'x' }, 'S')).toBe(true);
    expect(r.report('LW405', a, { detail: 'x' }, 'S')).toBe(false);
    // Another object with the same offsets is the same place.
    expect(r.report('LW405', span(0, 3), { detail: 'x' }, 'S')).toBe(false);
    expect(r.report('LW405', a, { detail: 'x' }, 'M')).toBe(true);
    expect(r.report('LW403', a, { detail: 'x' }, 'S')).toBe(true);
    expect(r.report('LW403', a, { detail: 'x' }, 'S', 'u3')).toBe(true);
    expect(r.calls).toBe(6);
    expect(r.finish().map((d) => d.code)).toEqual(['LW405', 'LW405', 'LW403', 'LW403']);
  });

  it('repeat() answers true only for a call already made from the same place, and counts it', () => {
    const r = new Reporter();
    const a = span(4, 9);
    expect(r.repeat('LW303', a, 'S', '')).toBe(false);
    expect(r.calls).toBe(0);
    r.report('LW303', a, {}, 'S');
    expect(r.repeat('LW303', a, 'S', '')).toBe(true);
    expect(r.repeat('LW303', a, 'M', '')).toBe(false);
    expect(r.repeat('LW303', a, 'S', 'k')).toBe(false);
    expect(r.repeat('LW302', a, 'S', '')).toBe(false);
    expect(r.calls).toBe(2);
  });

  it('repeat() is always false while tracing, so the trace keeps every call with its facts', () => {
    const r = new Reporter();
    const a = span(1, 2);
    r.report('LW303', a, {}, 'S');
    r.trace = [];
    expect(r.repeat('LW303', a, 'S', '')).toBe(false);
    r.report('LW303', a, { left: 1 }, 'S');
    expect(r.trace).toHaveLength(1);
  });

  it('past sixteen keys at one place, repeats are still recognised', () => {
    const r = new Reporter();
    const a = span(0, 1);
    for (let i = 0; i < 40; i++) expect(r.report('LW403', a, {}, 'S', `u${i}`)).toBe(i < 40);
    for (let i = 0; i < 40; i++) expect(r.report('LW403', a, {}, 'S', `u${i}`)).toBe(false);
  });
});

describe('a repeat that reports on every pass', () => {
  // Each pass adds a stitch (yo) and closes nothing (LW405): two and a half million passes pass the 2,000,000-stitch bound.
  const source = 'yarn A "Deep Harbour" #1d3557\ncast on 4\nround 1: (yo, close) 2500000 times\n';

  it('reports the problem once, then LW901 at the bound', () => {
    const result = compile(source);
    const codes = result.diagnostics.map((d) => d.code);
    expect(codes.filter((c) => c === 'LW405')).toHaveLength(1);
    expect(codes).toContain('LW901');
  });
});

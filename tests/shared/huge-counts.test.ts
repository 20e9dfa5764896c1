/**
 * Regression: a stitch with a huge count on a short needle must finish with a
 * count diagnostic instead of working the stitch billions of times (found by
 * `npm run fuzz`). No timing assertion: a hang would trip Vitest's timeout.
 */
import { describe, expect, it } from 'vitest';
import { compile } from '../../shared/index.ts';

const header = 'yarn A "Deep Harbour" #1d3557\ncast on 10\n';

describe('huge counts on a short needle', () => {
  it('bo 4294967297 on 10 stitches reports LW301 with both numbers', () => {
    const result = compile(`${header}round 1: bo 4294967297\n`);
    const lw301 = result.diagnostics.filter((d) => d.code === 'LW301');
    expect(lw301).toHaveLength(1);
    expect(lw301[0].message).toContain('4294967297');
    expect(lw301[0].message).toContain('10 are on the needle');
    expect(result.ok).toBe(false);
  });

  it('k2tog 99999999 stops at the 2,000,000-stitch bound (LW901)', () => {
    const result = compile(`${header}round 1: k2tog 99999999\n`);
    expect(result.diagnostics.map((d) => d.code)).toContain('LW901');
  });

  it('k 999999 after a bind-off of the whole needle counts what it could not work', () => {
    const result = compile(`${header}round 1: bo 10, k 999999\n`);
    const lw301 = result.diagnostics.find((d) => d.code === 'LW301');
    expect(lw301?.message).toContain('1000009');
  });
});

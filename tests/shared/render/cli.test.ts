import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { XMLValidator } from 'fast-xml-parser';
import { runRenderCommand, parseRenderArgs } from '../../../server/cli/render-commands.ts';

const ex = (f: string) => join(import.meta.dirname, '../../../examples', f);

function run(argv: string[]) {
  const out: string[] = [], err: string[] = [], files = new Map<string, string>();
  const code = runRenderCommand(argv, (s) => out.push(s), (s) => err.push(s), (p, t) => files.set(p, t));
  return { code, out: out.join('\n'), err: err.join('\n'), files };
}

describe('render commands (exit codes as check: 0 ok, 1 errors, 2 usage or unreadable)', () => {
  it('chart writes a well-formed SVG, front or back, to stdout or a file', () => {
    const front = run(['chart', ex('tidepool-cowl.loop'), '--size', 'M']);
    expect(front.code).toBe(0);
    expect(XMLValidator.validate(front.out)).toBe(true);
    expect(front.out).toContain('size M: chart, front');
    const back = run(['chart', ex('tidepool-cowl.loop'), '--back', '-o', 'out.svg']);
    expect(back.code).toBe(0);
    expect(back.files.get('out.svg')).toContain('back of the work');
    const window = run(['chart', ex('tidepool-cowl.loop'), '--rounds', '11-16']);
    expect(window.code).toBe(0);
    expect(window.out.match(/<g class="row" data-round="/g)?.length).toBe(6);
    expect(run(['chart', ex('tidepool-cowl.loop'), '--rounds', '900-901']).code).toBe(2);
  });

  it('instructions prints text with counts', () => {
    const r = run(['instructions', ex('lantern-mitts.loop'), '--size', 'S']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/Rnd 16: .*\(63 sts: 58 \+ 5 backing\)/);
  });

  it('a pattern with errors still renders, with exit 1 and the errors on stderr', () => {
    const r = run(['instructions', ex('broken/lw301-count-mismatch.loop')]);
    expect(r.code).toBe(1);
    expect(r.err).toContain('LW301');
    expect(r.out).toContain('Cast on');
  });

  it('usage problems and unreadable files exit 2', () => {
    expect(run(['chart']).code).toBe(2);
    expect(run(['chart', ex('tidepool-cowl.loop'), '--size', 'XXL']).code).toBe(2);
    expect(run(['chart', '/nonexistent/file.loop']).code).toBe(2);
    expect(run(['plan', ex('tidepool-cowl.loop')]).code).toBe(2);
    expect(run(['plan', ex('tidepool-cowl.loop'), '--rounds', '9-3']).code).toBe(2);
    expect(run(['instructions', ex('tidepool-cowl.loop'), '--back']).code).toBe(2);
    expect(parseRenderArgs(['plan', 'x.loop', '--rounds=2-5', '--segment', 'back'])).toEqual({ command: 'plan', file: 'x.loop', back: false, rounds: [2, 5], segment: 'back' });
  });

  it('plan reports and proves its proposal', () => {
    const r = run(['plan', ex('tidepool-cowl.loop'), '--rounds', '17-28']);
    expect(r.code).toBe(0);
    expect(r.out).toContain('proof:');
  });

  it('summary prints finished sizes, the yarn estimate labelled as one, and the cautions', () => {
    const r = run(['summary', ex('lantern-mitts.loop'), '--item', 'hand']);
    expect(r.code).toBe(0);
    expect(r.out).toContain('Finished circumference');
    expect(r.out).toContain('(estimate)');
    expect(r.out).toContain('not a safety certification');
    expect(r.out).toContain('hand circumference');
  });
});

describe('npm run loop dispatches the render commands', () => {
  it('chart, instructions and plan through the main entry, check unchanged', async () => {
    const { main } = await import('../../../server/cli/loop.ts');
    const out: string[] = [];
    const quiet = () => undefined;
    expect(main(['instructions', ex('quarry-tote-panel.loop')], (s) => out.push(s), quiet)).toBe(0);
    expect(out.join('\n')).toContain('Row 1 is a right-side (RS) row.');
    expect(main(['plan', ex('quarry-tote-panel.loop'), '--rounds', '10-22'], quiet, quiet)).toBe(0);
    expect(main(['chart', ex('quarry-tote-panel.loop'), '--size', 'M'], quiet, quiet)).toBe(2);
    expect(main(['check', ex('quarry-tote-panel.loop'), '--json'], quiet, quiet)).toBe(0);
  });
});

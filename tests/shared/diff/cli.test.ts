// The diff command of the CLI (server/cli/diff-command.ts): exit codes as
// notation.md gives them for every command (0 no error, 1 errors, 2 usage or
// unreadable file) and --json printing exactly one RevisionDiff object.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runDiff } from '../../../server/cli/diff-command';
import { diffRevisions } from '../../../shared/diff';
import { HERE, readCase } from './cases';

const fixture = (name: string) => join(HERE, 'fixtures', name);

async function run(argv: string[]): Promise<{ code: number; out: string[]; err: string[] }> {
  const out: string[] = [], err: string[] = [];
  const code = await runDiff(argv, { out: (s) => out.push(s), err: (s) => err.push(s) });
  return { code, out, err };
}

describe('loop diff', () => {
  it('exits 0 and prints the text report when both revisions compile', async () => {
    const r = await run([fixture('moved-column.old.loop'), fixture('moved-column.new.loop')]);
    expect(r.code).toBe(0);
    expect(r.err).toEqual([]);
    expect(r.out.join('\n')).toContain('backing column moved: B after stitch 12, rows 3-11 -> B after stitch 15, rows 3-11');
  });

  it('prints one JSON object equal to diffRevisions with --json, and exits 1 when a revision has errors', async () => {
    const r = await run(['--json', fixture('diagnostics.old.loop'), fixture('diagnostics.new.loop')]);
    expect(r.code).toBe(1);
    expect(r.out).toHaveLength(1);
    const src = readCase('diagnostics');
    expect(JSON.parse(r.out[0])).toEqual(diffRevisions(src.old, src.new));
  });

  it('diffs one size with --size', async () => {
    const r = await run([fixture('changed-repeat.old.loop'), fixture('changed-repeat.new.loop'), '--size', 'M', '--json']);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.out[0]).sizes.map((s: { size: string }) => s.size)).toEqual(['M']);
  });

  it('exits 2 on usage problems and unreadable files, printing nothing on stdout', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'loop-diff-'));
    const latin1 = join(dir, 'latin1.loop');
    writeFileSync(latin1, Buffer.from([0x74, 0x69, 0x74, 0x6c, 0x65, 0x20, 0xe9]));
    const cases: string[][] = [
      [],
      [fixture('moved-column.old.loop')],
      [fixture('moved-column.old.loop'), fixture('moved-column.new.loop'), '--colour'],
      [fixture('moved-column.old.loop'), fixture('moved-column.new.loop'), '--size'],
      [fixture('moved-column.old.loop'), join(dir, 'missing.loop')],
      [fixture('moved-column.old.loop'), latin1],
      [fixture('moved-column.old.loop'), fixture('moved-column.new.loop'), '--size', 'XXL'],
    ];
    for (const argv of cases) {
      const r = await run(argv);
      expect(r.code, argv.join(' ')).toBe(2);
      expect(r.out).toEqual([]);
      expect(r.err.join('\n')).toMatch(/usage|cannot read|not UTF-8|neither revision/);
    }
  });

  it('is reachable as `npm run loop -- diff` (the real entry point, server/cli/loop.ts)', () => {
    const tsx = join(HERE, '..', '..', '..', 'node_modules', '.bin', 'tsx');
    const loop = join(HERE, '..', '..', '..', 'server', 'cli', 'loop.ts');
    const ok = spawnSync(tsx, [loop, 'diff', fixture('header-change.old.loop'), fixture('header-change.new.loop'), '--json'], { encoding: 'utf8' });
    expect(ok.status).toBe(0);
    expect(JSON.parse(ok.stdout).header.yarns.recoloured).toEqual([{ name: 'B', old: '#e6f2ee', new: '#5a7d4f' }]);
    const bad = spawnSync(tsx, [loop, 'diff', fixture('header-change.old.loop')], { encoding: 'utf8' });
    expect(bad.status).toBe(2);
    expect(bad.stdout).toBe('');
  });
});

/**
 * The demo patterns compile with no errors in every size, use what the
 * notation is for (backing stitches flat and in the round, a gusset segment
 * at the same time as a chart, several sizes), and the command line keeps
 * its contract (notation.md "The command line": exit codes and JSON shape).
 */
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { writeFileSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { compile, toCheckJson } from '../../shared/index.ts';
import { main } from '../../server/cli/loop.ts';
import { examples, root } from './fixtures.ts';

function run(args: string[]): { code: number; out: string; err: string } {
  let out = '', err = '';
  const code = main(args, (s) => { out += s; }, (s) => { err += s; });
  return { code, out, err };
}

describe('demo patterns', () => {
  const all = examples();

  it('are the three patterns of the demo scenario', () => {
    expect(all.map((e) => e.file)).toEqual(['lantern-mitts.loop', 'quarry-tote-panel.loop', 'tidepool-cowl.loop']);
  });

  for (const e of all) {
    it(`${e.file} compiles with no errors in every size`, () => {
      const r = compile(e.source);
      expect(r.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
      expect(r.ok).toBe(true);
      for (const s of r.sizes) {
        expect(s.rounds.length).toBeGreaterThan(20);
        for (const rec of s.stitches.rounds) expect(rec.front + rec.backing).toBe(rec.count);
      }
    });
  }

  it('together use backing stitches in the round and flat (picked up on a WS row), a gusset segment beside a chart, and sizes', () => {
    const by = Object.fromEntries(all.map((e) => [e.file, compile(e.source)]));
    const cowl = by['tidepool-cowl.loop'], mitts = by['lantern-mitts.loop'], tote = by['quarry-tote-panel.loop'];
    expect(cowl.header.construction).toBe('round');
    expect(cowl.sizes[0].rounds.some((x) => x.backing > 0)).toBe(true);
    expect(mitts.header.sizes).toEqual(['S', 'M', 'L']);
    const gussetRound = mitts.sizes[1].stitches.rounds.find((x) => x.segments.some((s) => s.name === 'gusset' && s.to > s.from))!;
    expect(gussetRound.segments.map((s) => s.name)).toContain('back');
    expect(tote.header.construction).toBe('flat');
    const t = tote.sizes[0].stitches;
    const raisedOnWs = t.rounds.some((rec) => rec.side === 'WS' && Array.from(t.store.op.subarray(rec.offset, rec.offset + rec.count)).some((op) => t.ops[op].name === 'raise'));
    expect(raisedOnWs).toBe(true);
  });
});

describe('loop check (notation.md command line contract)', () => {
  const tmp = mkdtempSync(path.join(tmpdir(), 'loop-cli-'));

  it('--json prints exactly the documented shape and exits 0 without errors', () => {
    const res = run(['check', path.join(root, 'examples', 'lantern-mitts.loop'), '--json', '--size', 'M']);
    expect(res.code).toBe(0);
    const json = JSON.parse(res.out);
    expect(Object.keys(json)).toEqual(['ok', 'diagnostics', 'sizes']);
    expect(json.ok).toBe(true);
    expect(json.sizes.map((s: { name: string }) => s.name)).toEqual(['M']);
    expect(Object.keys(json.sizes[0].rounds[0])).toEqual(['number', 'side', 'front', 'backing', 'total', 'longestFloat']);
    expect(json.sizes[0].rounds[0]).toEqual({ number: 1, side: 'RS', front: 64, backing: 0, total: 64, longestFloat: null });
  });

  it('exits 1 with coded diagnostics on errors, each with line, column, end, size, code, severity, message', () => {
    const file = path.join(tmp, 'bad.loop');
    writeFileSync(file, 'sizes S M\nyarn A "Harbour" #1d3557\ncast on 60\nround 1: k 58');
    const res = run(['check', file, '--json']);
    expect(res.code).toBe(1);
    const json = JSON.parse(res.out);
    expect(json.ok).toBe(false);
    expect(json.diagnostics[0]).toEqual({ code: 'LW301', severity: 'error', line: 4, column: 1, endLine: 4, endColumn: 14, size: 'S', message: 'round 1 works 58 stitches but 60 are on the needle (size S)' });
  });

  it('exits 2 on usage problems and unreadable files', () => {
    expect(run([]).code).toBe(2);
    expect(run(['check']).code).toBe(2);
    expect(run(['check', path.join(tmp, 'missing.loop')]).code).toBe(2);
    expect(run(['check', path.join(root, 'examples', 'tidepool-cowl.loop'), '--size', 'XXL']).code).toBe(2);
    expect(run(['check', path.join(root, 'examples', 'tidepool-cowl.loop'), '--frobnicate']).code).toBe(2);
    const binary = path.join(tmp, 'binary.loop');
    writeFileSync(binary, Buffer.from([0xff, 0xfe, 0x00, 0xc3]));
    expect(run(['check', binary]).code).toBe(2);
  });

  it('a 2 MB random file gives exit 1 with coded diagnostics and no stack trace (through npm run loop)', () => {
    const file = path.join(tmp, 'random.loop');
    let s = '';
    let seed = 7;
    const next = () => (seed = (seed * 1103515245 + 12345) % 2147483648);
    const alphabet = 'abcdefghijklmnopqrstuvwxyz0123456789 \n():,/-"#|@round k p chart ';
    while (s.length < 2_000_000) s += alphabet[next() % alphabet.length];
    writeFileSync(file, s);
    const res = spawnSync(process.execPath, ['--import', 'tsx', path.join(root, 'server', 'cli', 'loop.ts'), 'check', file, '--json'], { cwd: root, encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
    expect(res.status).toBe(1);
    expect(res.stderr).not.toMatch(/at .*\.ts:\d+/);
    const json = JSON.parse(res.stdout);
    expect(json.ok).toBe(false);
    expect(json.diagnostics.length).toBeGreaterThan(0);
    expect(json.diagnostics.every((d: { code: string }) => /^LW\d{3}$/.test(d.code))).toBe(true);
  });

  it('`npm run loop -- check FILE --json` prints exactly one JSON object on stdout (no npm banner) and keeps the exit code', () => {
    const ok = spawnSync('npm', ['run', 'loop', '--', 'check', 'examples/tidepool-cowl.loop', '--json'], { cwd: root, encoding: 'utf8', maxBuffer: 16 * 1024 * 1024 });
    expect(ok.status).toBe(0);
    expect(JSON.parse(ok.stdout).ok).toBe(true);
    const bad = spawnSync('npm', ['run', 'loop', '--', 'check', 'examples/broken/lw301-count-mismatch.loop', '--json'], { cwd: root, encoding: 'utf8' });
    expect(bad.status).toBe(1);
    expect(JSON.parse(bad.stdout).diagnostics[0].code).toBe('LW301');
  });

  it('the JSON is toCheckJson of compile for the same file', () => {
    const file = path.join(root, 'examples', 'quarry-tote-panel.loop');
    const res = run(['check', file, '--json']);
    expect(JSON.parse(res.out)).toEqual(toCheckJson(compile(examples().find((e) => e.file === 'quarry-tote-panel.loop')!.source)));
  });
});

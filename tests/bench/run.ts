/**
 * `npm run bench`: compile time against JSON.parse of the compiler's own
 * stitch-level result (every stitch with its operation, yarn and layer),
 * for generated patterns of about 10k, 100k and 1M stitches. Prints the
 * figures and writes .data/bench/latest.json with at least
 * {"compileVsJsonParse": ratio at 100k, "growth10x": time(1M) / time(100k)}.
 * A benchmark, not a test: it never fails on speed.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { compile, type CompileResult } from '../../shared/index.ts';
import { benchSource } from './generate.ts';

const root = path.resolve(import.meta.dirname, '..', '..');

/** The stitch-level result as JSON: rounds of {op, yarn, layer} per stitch. */
export function stitchLevelJson(r: CompileResult): string {
  const size = r.sizes[0];
  const { store, ops, yarns } = size.stitches;
  const rounds = size.stitches.rounds.map((rec) => {
    const stitches = [];
    for (let i = rec.offset; i < rec.offset + rec.count; i++) {
      stitches.push({ op: ops[store.op[i]].name, yarn: yarns[store.yarn[i]], layer: store.flags[i] & 1 ? 'backing' : 'front' });
    }
    return { number: rec.number, side: rec.side, stitches };
  });
  return JSON.stringify({ size: size.name, rounds });
}

/** Median of `runs` timings of fn, in ms (after `warm` untimed runs). */
function time(fn: () => unknown, runs: number, warm: number): number {
  for (let i = 0; i < warm; i++) fn();
  const t: number[] = [];
  for (let i = 0; i < runs; i++) {
    const s = performance.now();
    fn();
    t.push(performance.now() - s);
  }
  t.sort((a, b) => a - b);
  return t[Math.floor(t.length / 2)];
}

const sizes = [10_000, 100_000, 1_000_000];
const rows: { target: number; stitches: number; sourceBytes: number; jsonBytes: number; compileMs: number; jsonParseMs: number; ratio: number }[] = [];
for (const target of sizes) {
  const source = benchSource(target);
  const result = compile(source);
  if (!result.ok) throw new Error(`bench pattern of ${target} has errors: ${result.diagnostics[0]?.message}`);
  const json = stitchLevelJson(result);
  const stitches = result.sizes[0].stitches.rounds.reduce((n, r) => n + r.count, 0);
  const runs = target >= 1_000_000 ? 5 : 15;
  const compileMs = time(() => compile(source), runs, 3);
  const jsonParseMs = time(() => JSON.parse(json), runs, 3);
  rows.push({ target, stitches, sourceBytes: source.length, jsonBytes: json.length, compileMs, jsonParseMs, ratio: compileMs / jsonParseMs });
}

for (const r of rows) {
  console.log(
    `${String(r.target).padStart(8)} target  ${String(r.stitches).padStart(8)} stitches  source ${r.sourceBytes} B  ` +
      `compile ${r.compileMs.toFixed(2)} ms  JSON.parse ${r.jsonParseMs.toFixed(2)} ms (${(r.jsonBytes / 1e6).toFixed(2)} MB)  ratio ${r.ratio.toFixed(2)}`,
  );
}
const at100k = rows.find((r) => r.target === 100_000)!;
const at1m = rows.find((r) => r.target === 1_000_000)!;
const summary = {
  compileVsJsonParse: Number(at100k.ratio.toFixed(3)),
  growth10x: Number((at1m.compileMs / at100k.compileMs).toFixed(3)),
  node: process.version,
  measuredAt: new Date().toISOString(),
  rows,
};
console.log(`compileVsJsonParse ${summary.compileVsJsonParse} (goal <= 1.0), growth10x ${summary.growth10x} (goal <= 11)`);
const dir = path.join(root, '.data', 'bench');
mkdirSync(dir, { recursive: true });
writeFileSync(path.join(dir, 'latest.json'), JSON.stringify(summary, null, 2) + '\n');

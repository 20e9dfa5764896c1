/**
 * `npm run bench`: compile time against JSON.parse of the compiler's own
 * stitch-level result (every stitch with its operation, yarn and layer),
 * for generated patterns of about 10k, 100k and 1M stitches, then the edit,
 * bundle and HTTP figures (figures.ts). Prints the figures and writes
 * .data/bench/latest.json with at least
 * {"compileVsJsonParse": ratio at 100k, "growth10x": time(1M) / time(100k)}.
 * A benchmark, not a test: it never fails on speed.
 *
 * Flags (after `npm run bench --`):
 * - `--only PARTS`: a comma-separated subset of `compile`, `edit`, `bundles`,
 *   `api`, `capacity` (e.g. `--only api`). Only those are measured, and the result goes
 *   to `.data/bench/latest-<parts>.json`, so latest.json keeps the last full run.
 * - `--api-rounds N`, `--api-seconds S`: rounds of the HTTP figure and seconds
 *   per route per round (defaults in api.ts, API_BENCH_DEFAULTS).
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { compile, type CompileResult } from '../../shared/index.ts';
import { benchSource } from './generate.ts';
import { BENCH_PARTS, formatFigureTable, measureOtherFigures, parseBenchArgs, type Figure } from './figures.ts';

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

/**
 * Median and fastest of `runs` timings of fn, in ms (after `warm` untimed
 * runs). The headline ratios use medians; the fastest runs (least disturbed
 * by other work on a shared machine) are kept beside them.
 */
function time(fn: () => unknown, runs: number, warm: number): { min: number; median: number } {
  for (let i = 0; i < warm; i++) fn();
  const t: number[] = [];
  for (let i = 0; i < runs; i++) {
    const s = performance.now();
    fn();
    t.push(performance.now() - s);
  }
  t.sort((a, b) => a - b);
  return { min: t[0], median: t[Math.floor(t.length / 2)] };
}

const args = parseBenchArgs(process.argv.slice(2));
const onlySome = args.parts.size < BENCH_PARTS.length;
const loadStart = os.loadavg()[0];

/** The compile figures: timings at 10k, 100k and 1M stitches, printed as they are measured. */
function measureCompileFigures() {
  const sizes = [10_000, 100_000, 1_000_000];
  const rows: {
    target: number; stitches: number; sourceBytes: number; jsonBytes: number;
    compileMs: number; jsonParseMs: number; ratio: number; compileMinMs: number; jsonParseMinMs: number; minRatio: number;
  }[] = [];
  for (const target of sizes) {
    const source = benchSource(target);
    const result = compile(source);
    if (!result.ok) throw new Error(`bench pattern of ${target} has errors: ${result.diagnostics[0]?.message}`);
    const json = stitchLevelJson(result);
    const stitches = result.sizes[0].stitches.rounds.reduce((n, r) => n + r.count, 0);
    // Warm up well first: the figures are for a compiler that has run before (as in the studio and the server).
    const runs = target >= 1_000_000 ? 9 : 41;
    const warm = target >= 1_000_000 ? 3 : 15;
    const c = time(() => compile(source), runs, warm);
    const j = time(() => JSON.parse(json), runs, warm);
    rows.push({
      target, stitches, sourceBytes: source.length, jsonBytes: json.length,
      compileMs: c.median, jsonParseMs: j.median, ratio: c.median / j.median,
      compileMinMs: c.min, jsonParseMinMs: j.min, minRatio: c.min / j.min,
    });
  }

  for (const r of rows) {
    console.log(
      `${String(r.target).padStart(8)} target  ${String(r.stitches).padStart(8)} stitches  source ${r.sourceBytes} B  ` +
        `compile ${r.compileMs.toFixed(2)} ms  JSON.parse ${r.jsonParseMs.toFixed(2)} ms (${(r.jsonBytes / 1e6).toFixed(2)} MB)  ratio ${r.ratio.toFixed(2)}  ` +
        `(fastest ${r.compileMinMs.toFixed(2)} / ${r.jsonParseMinMs.toFixed(2)} ms, ratio ${r.minRatio.toFixed(2)})`,
    );
  }
  const at100k = rows.find((r) => r.target === 100_000)!;
  const at1m = rows.find((r) => r.target === 1_000_000)!;
  const summary = {
    compileVsJsonParse: Number(at100k.ratio.toFixed(3)),
    growth10x: Number((at1m.compileMs / at100k.compileMs).toFixed(3)),
    compileVsJsonParseFastest: Number(at100k.minRatio.toFixed(3)),
    growth10xFastest: Number((at1m.compileMinMs / at100k.compileMinMs).toFixed(3)),
    loadAverage: os.loadavg()[0],
    rows,
  };
  console.log(`compileVsJsonParse ${summary.compileVsJsonParse} (goal <= 1.0), growth10x ${summary.growth10x} (goal <= 11)`);
  return summary;
}

const compiled = args.parts.has('compile') ? measureCompileFigures() : null;
// The other figures (tests/bench/figures.ts), measured in the same run, then one table of all of them.
const other = await measureOtherFigures(args);
const figures: Figure[] = [
  ...(compiled ? [
    { name: 'compileVsJsonParse', value: compiled.compileVsJsonParse, goal: 1.0, unit: 'x' },
    { name: 'growth10x', value: compiled.growth10x, goal: 11, unit: 'x' },
  ] : []),
  ...other.figures,
];
const loadAfter = os.loadavg()[0];
const loadNote = compiled ? `${compiled.loadAverage.toFixed(2)} after the compile figures` : `${loadStart.toFixed(2)} at the start`;
if (figures.length) console.log(`\n${formatFigureTable(figures)}`);
console.log(`(load average ${loadNote}, ${loadAfter.toFixed(2)} at the end, ${os.cpus().length} cores)`);
const all = {
  ...(compiled ?? {}),
  parts: [...args.parts],
  node: process.version,
  measuredAt: new Date().toISOString(),
  ...Object.fromEntries(other.figures.map((f) => [f.name, f.value])),
  goals: Object.fromEntries(figures.map((f) => [f.name, f.goal])),
  met: Object.fromEntries(figures.map((f) => [f.name, f.value !== null && f.value <= f.goal])),
  loadAverageStart: loadStart,
  loadAverageEnd: loadAfter,
  details: other.details,
};
const dir = path.join(root, '.data', 'bench');
mkdirSync(dir, { recursive: true });
const file = onlySome ? `latest-${[...args.parts].join('-')}.json` : 'latest.json';
writeFileSync(path.join(dir, file), JSON.stringify(all, null, 2) + '\n');
console.log(`written to .data/bench/${file}`);
if (Object.keys(other.details.errors).length) process.exitCode = 1;

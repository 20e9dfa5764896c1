/**
 * The figures of `npm run bench` beside the compile ones (tests/bench/run.ts):
 * the edit figure (edit.ts), the bundle sizes (bundles.ts) and the HTTP load
 * figure (api.ts), and the printed table of all five against their goals
 * (the benchmark issue); then the capacity numbers (capacity.ts: revision
 * saves and export CPU), which have no goal but decide when to grow. A part that cannot run is reported with its error
 * and a null figure; the others still run.
 */
import { formatApiFigure, measureApiOn, startApiStack, type ApiBenchOptions, type ApiFigure, type ApiStack } from './api.ts';
import { formatCapacity, measureExports, measureSaves, type ExportCapacity, type SaveCapacity } from './capacity.ts';
import { measureBundleFigures } from './bundles.ts';
import { measureEdit, type EditFigure } from './edit.ts';

/** The parts of `npm run bench` that `--only` can pick. */
export const BENCH_PARTS = ['compile', 'edit', 'bundles', 'api', 'capacity'] as const;
export type BenchPart = (typeof BENCH_PARTS)[number];

/** What the command line asked for: the parts to measure and settings of the HTTP figure. */
export interface BenchArgs { parts: Set<BenchPart>; api: Partial<ApiBenchOptions> }

/**
 * Reads `--only a,b` (or `--only=a,b`), `--api-rounds N` and `--api-seconds S`.
 * Throws on an unknown flag or part, so a typo does not silently run everything.
 */
export function parseBenchArgs(argv: readonly string[]): BenchArgs {
  const parts = new Set<BenchPart>(BENCH_PARTS);
  const api: Partial<ApiBenchOptions> = {};
  for (let i = 0; i < argv.length; i++) {
    const [flag, inline] = argv[i].split(/=(.*)/s, 2);
    const value = () => {
      const v = inline ?? argv[++i];
      if (v === undefined) throw new Error(`bench: ${flag} needs a value`);
      return v;
    };
    const count = (v: string) => {
      const n = Number(v);
      if (!Number.isInteger(n) || n < 1) throw new Error(`bench: ${flag} needs a whole number of at least 1, not "${v}"`);
      return n;
    };
    if (flag === '--only') {
      parts.clear();
      for (const p of value().split(',').map((x) => x.trim()).filter(Boolean)) {
        if (!(BENCH_PARTS as readonly string[]).includes(p)) throw new Error(`bench: unknown part "${p}" (parts: ${BENCH_PARTS.join(', ')})`);
        parts.add(p as BenchPart);
      }
      if (parts.size === 0) throw new Error(`bench: --only needs at least one of ${BENCH_PARTS.join(', ')}`);
    } else if (flag === '--api-rounds') api.rounds = count(value());
    else if (flag === '--api-seconds') api.seconds = count(value());
    else throw new Error(`bench: unknown flag "${argv[i]}" (flags: --only ${BENCH_PARTS.join(',')}, --api-rounds N, --api-seconds S)`);
  }
  return { parts, api };
}

/** One headline figure: value (null when it could not be measured), goal (value <= goal), unit. */
export interface Figure { name: string; value: number | null; goal: number; unit: string; error?: string }

/** The figures besides the compile ones, plus their details for latest.json. */
export interface OtherFigures {
  figures: Figure[];
  details: {
    edit?: EditFigure[]; bundles?: unknown; api?: ApiFigure;
    /** The capacity numbers (capacity.ts): not goal figures, the inputs of docs/scaling.md's "When to grow". */
    capacity?: { saves: SaveCapacity | null; exports: ExportCapacity[] | null };
    errors: Record<string, string>;
  };
}

const message = (err: unknown) => (err instanceof Error ? err.message : String(err));
const round = (n: number, digits = 3) => Number(n.toFixed(digits));

/** Measures the edit, bundle and API figures that `args` selects (default all), one after the other. */
export async function measureOtherFigures(args: BenchArgs = { parts: new Set(BENCH_PARTS), api: {} }): Promise<OtherFigures> {
  const figures: Figure[] = [];
  const details: OtherFigures['details'] = { errors: {} };

  if (args.parts.has('edit')) try {
    // The headline edit changes a round's stitches; a note and a comment edit are shown beside it.
    const edits = (['instructions', 'note', 'comment'] as const).map((k) => measureEdit(k));
    details.edit = edits.map((e) => ({ ...e, fullMs: round(e.fullMs, 2), editMs: round(e.editMs, 2), ratio: round(e.ratio) }));
    figures.push({ name: 'editVsFull', value: round(edits[0].ratio), goal: 0.1, unit: 'x' });
  } catch (err) {
    details.errors.editVsFull = message(err);
    figures.push({ name: 'editVsFull', value: null, goal: 0.1, unit: 'x', error: message(err) });
  }

  if (args.parts.has('bundles')) try {
    const { sizes, built } = measureBundleFigures();
    details.bundles = { ...sizes, builtNow: built };
    figures.push({ name: 'firstLoadKB', value: round(sizes.firstLoadGzip / 1024, 1), goal: 150, unit: 'KB' });
    figures.push({ name: 'workspaceKB', value: round(sizes.workspaceGzip / 1024, 1), goal: 300, unit: 'KB' });
  } catch (err) {
    details.errors.bundles = message(err);
    figures.push({ name: 'firstLoadKB', value: null, goal: 150, unit: 'KB', error: message(err) });
    figures.push({ name: 'workspaceKB', value: null, goal: 300, unit: 'KB', error: message(err) });
  }

  // The HTTP figure and the save capacity share one private stack (database, SMTP, app).
  let stack: ApiStack | null = null;
  let stackError: unknown = null;
  if (args.parts.has('api') || args.parts.has('capacity')) {
    try { stack = await startApiStack(); } catch (err) { stackError = err; }
  }
  try {
    if (args.parts.has('api')) try {
      if (!stack) throw stackError;
      const api = await measureApiOn(stack, args.api);
      console.log(formatApiFigure(api));
      details.api = { ...api, p99Ratio: round(api.p99Ratio) };
      figures.push({ name: 'apiP99VsHealth', value: round(api.p99Ratio), goal: 3, unit: 'x' });
    } catch (err) {
      details.errors.apiP99VsHealth = message(err);
      figures.push({ name: 'apiP99VsHealth', value: null, goal: 3, unit: 'x', error: message(err) });
    }

    if (args.parts.has('capacity')) {
      const capacity: { saves: SaveCapacity | null; exports: ExportCapacity[] | null } = { saves: null, exports: null };
      try {
        if (!stack) throw stackError;
        capacity.saves = await measureSaves(stack);
      } catch (err) { details.errors.saves = message(err); }
      try { capacity.exports = await measureExports(); } catch (err) { details.errors.exports = message(err); }
      console.log(formatCapacity(capacity.saves, capacity.exports));
      details.capacity = capacity;
    }
  } finally {
    await stack?.stop();
  }
  return { figures, details };
}

/** The printed table: figure, value, goal, met/missed. */
export function formatFigureTable(figures: Figure[]): string {
  const rows = [['figure', 'value', 'goal', 'status'], ...figures.map((f) => [
    f.name, f.value === null ? 'not measured' : `${f.value} ${f.unit}`, `<= ${f.goal} ${f.unit}`,
    f.value === null ? `error: ${f.error ?? ''}` : f.value <= f.goal ? 'met' : 'missed',
  ])];
  const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => r[c].length)));
  const line = (r: string[]) => r.map((cell, c) => cell.padEnd(widths[c])).join('  ');
  return [line(rows[0]), widths.map((w) => '-'.repeat(w)).join('  '), ...rows.slice(1).map(line)].join('\n');
}

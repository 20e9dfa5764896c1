/**
 * The fuzz properties, shared by `npm run fuzz` (tests/fuzz/run.ts, a
 * million cases with timing) and `npm test` (tests/shared/fuzz.test.ts, a
 * few thousand of the same cases, no timing).
 *
 * For every source the compiler must (house-style.md, "Property tests";
 * contracts.md, `compile`):
 *  - not throw;
 *  - give spans inside the source whose line/column agree with the offsets
 *    (lines end at \n, \r\n or \r, as CodeMirror counts them), for every
 *    diagnostic and every related span;
 *  - be deterministic: a second compile gives an equal result, compared
 *    in full (every field of the CompileResult, the stitch-level typed
 *    arrays of every size included; see `firstDifference`);
 *  - keep `ok` equal to "no error diagnostic".
 * The runner also times each compile (tests/fuzz/run.ts states the budget).
 */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import fc from 'fast-check';
import { compile, toCheckJson, type CompileResult, type Span } from '../../shared/index.ts';
import { loopSource } from './grammar-arbitrary.ts';
import { mutatedFrom } from './mutate.ts';

const root = path.resolve(import.meta.dirname, '..', '..');

/** A seed source from the repository: the demo patterns and the broken fixtures. */
export interface CorpusFile { file: string; source: string }

/** Reads examples/*.loop (`demo`) and examples/broken/*.loop (`broken`), sorted by name so seeds replay. */
export function loadCorpus(): { demo: CorpusFile[]; broken: CorpusFile[] } {
  const read = (dir: string) =>
    readdirSync(path.join(root, dir))
      .filter((f) => f.endsWith('.loop'))
      .sort()
      .map((f) => ({ file: `${dir}/${f}`, source: readFileSync(path.join(root, dir, f), 'utf8') }));
  return { demo: read('examples'), broken: read('examples/broken') };
}

/** Where a case came from, for the report. */
export type CaseKind = 'generated' | 'mutated-generated' | 'mutated-broken' | 'mutated-demo' | 'demo';

/** One fuzz case: the source and how it was made. */
export interface FuzzCase { kind: CaseKind; source: string }

/**
 * The case arbitrary: grammar-generated sources (50%), generated sources
 * with edits (15%), broken fixtures with edits (30%), demo patterns with
 * edits (4%) and unedited demo patterns (1%). The demo patterns are the
 * largest seeds (about 10-25 ms a compile here), hence their smaller share.
 */
export function fuzzCase(corpus = loadCorpus()): fc.Arbitrary<FuzzCase> {
  const demo = fc.constantFrom(...corpus.demo.map((c) => c.source));
  const broken = fc.constantFrom(...corpus.broken.map((c) => c.source));
  const tag = (kind: CaseKind) => (source: string): FuzzCase => ({ kind, source });
  return fc.oneof(
    { weight: 50, arbitrary: loopSource().map(tag('generated')) },
    { weight: 15, arbitrary: mutatedFrom(loopSource()).map(tag('mutated-generated')) },
    { weight: 30, arbitrary: mutatedFrom(broken).map(tag('mutated-broken')) },
    { weight: 4, arbitrary: mutatedFrom(demo).map(tag('mutated-demo')) },
    { weight: 1, arbitrary: demo.map(tag('demo')) },
  );
}

/** Line and column (1-based) of every offset, computed once per source. */
function lineStarts(source: string): number[] {
  const starts = [0];
  for (let i = 0; i < source.length; i++) {
    const c = source.charCodeAt(i);
    if (c === 10 || (c === 13 && source.charCodeAt(i + 1) !== 10)) starts.push(i + 1);
  }
  return starts;
}

function position(starts: number[], offset: number): { line: number; column: number } {
  let lo = 0, hi = starts.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (starts[mid] <= offset) lo = mid;
    else hi = mid - 1;
  }
  return { line: lo + 1, column: offset - starts[lo] + 1 };
}

/** Why a span is wrong, or null when it is in bounds and its line/column agree with its offsets. */
export function spanProblem(source: string, starts: number[], s: Span): string | null {
  if (!Number.isInteger(s.from) || !Number.isInteger(s.to)) return `offsets are not integers (${s.from}..${s.to})`;
  if (s.from < 0 || s.to < s.from || s.to > source.length) return `offsets ${s.from}..${s.to} outside 0..${source.length}`;
  const a = position(starts, s.from), b = position(starts, s.to);
  if (a.line !== s.line || a.column !== s.column) return `start ${s.line}:${s.column} but offset ${s.from} is ${a.line}:${a.column}`;
  if (b.line !== s.endLine || b.column !== s.endColumn) return `end ${s.endLine}:${s.endColumn} but offset ${s.to} is ${b.line}:${b.column}`;
  return null;
}

/**
 * Where two values first differ, as a path such as
 * `.sizes[0].stitches.store.op[17]`, or null when they are equal in full:
 * same prototype, same own keys in the same order, equal values (by
 * `Object.is`), arrays element by element, typed arrays byte by byte
 * (memcmp through Buffer.compare, so a two-million-stitch model costs
 * milliseconds). Shared or repeated objects are compared where they occur;
 * nesting past 200 levels (only a cycle could do that) is reported.
 *
 * Used for the determinism property in place of comparing two JSON strings:
 * stricter (JSON drops the stitch-level model, undefined fields and key
 * order differences of nested objects are still caught here) and cheaper
 * (no strings are built when the results agree).
 */
export function firstDifference(a: unknown, b: unknown): string | null {
  const d = differ(a, b, 0);
  return d === null ? null : d || '(root)';
}

/** The path below `a`/`b` where they first differ ('' for here), or null; paths are built only on a difference. */
function differ(a: unknown, b: unknown, depth: number): string | null {
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return Object.is(a, b) ? null : '';
  // Compile results are shallow trees (about six levels); this deep is a cycle.
  if (depth > 200) return ' (nested more than 200 levels)';
  const proto = Object.getPrototypeOf(a);
  if (proto !== Object.getPrototypeOf(b)) return ' (different kinds of object)';
  if (proto === Array.prototype) {
    const x = a as unknown[], y = b as unknown[];
    if (x.length !== y.length) return '.length';
    for (let i = 0; i < x.length; i++) {
      const u = x[i], v = y[i];
      if (u === v) continue;
      const d = differ(u, v, depth + 1);
      if (d !== null) return `[${i}]${d}`;
    }
    return null;
  }
  if (ArrayBuffer.isView(a)) {
    const v = b as ArrayBufferView;
    if (a.byteLength !== v.byteLength) return '.length';
    if (a.byteLength <= 256) {
      // Short arrays: a loop is cheaper than making two Buffer views.
      const x = new Uint8Array(a.buffer, a.byteOffset, a.byteLength), y = new Uint8Array(v.buffer, v.byteOffset, v.byteLength);
      for (let i = 0; i < x.length; i++) if (x[i] !== y[i]) return `[byte ${i}]`;
      return null;
    }
    const x = Buffer.from(a.buffer, a.byteOffset, a.byteLength), y = Buffer.from(v.buffer, v.byteOffset, v.byteLength);
    if (x.equals(y)) return null;
    let i = 0;
    while (x[i] === y[i]) i++;
    return `[byte ${i}]`;
  }
  if (a instanceof Map || a instanceof Set) {
    const d = differ([...a.entries()], [...(b as Map<unknown, unknown> | Set<unknown>).entries()], depth + 1);
    return d === null ? null : `.entries${d}`;
  }
  const x = a as Record<string, unknown>, y = b as Record<string, unknown>;
  const ka = Object.keys(x), kb = Object.keys(y);
  if (ka.length !== kb.length) return ` (keys ${ka.join(',')} vs ${kb.join(',')})`;
  for (let i = 0; i < ka.length; i++) {
    const k = ka[i];
    if (k !== kb[i]) return ` (keys ${ka.join(',')} vs ${kb.join(',')})`;
    const u = x[k], v = y[k];
    if (u === v) continue;
    const d = differ(u, v, depth + 1);
    if (d !== null) return `.${k}${d}`;
  }
  return null;
}

/** Everything a compile must agree on between two runs: the CLI JSON plus spans, hints and related places (for messages; the property compares in full with `firstDifference`). */
export function canonicalJson(r: CompileResult): string {
  return JSON.stringify({
    check: toCheckJson(r),
    header: r.header,
    diagnostics: r.diagnostics.map((d) => [d.code, d.span.from, d.span.to, d.hint ?? null, d.related?.map((x) => [x.span.from, x.span.to, x.message]) ?? null]),
  });
}

/** A property failure: what went wrong, with the error's stack when the compiler threw. */
/** Per-case time budget in ms (issue 8). */
export const BUDGET_MS = 100;
/** Models up to this many units (stitches, round records and operations carried out, over all sizes) get the flat budget; larger ones a proportional one. */
export const FLAT_BUDGET_UNITS = 100_000;
/** The time budget of a case whose model holds `units` units (stitches, round records and operations carried out), in ms. */
export function budgetFor(units: number, budgetMs = BUDGET_MS): number {
  return budgetMs * Math.max(1, units / FLAT_BUDGET_UNITS);
}

export interface Failure { kind: 'throw' | 'span' | 'determinism' | 'ok-flag' | 'slow' | 'hang'; message: string; stack?: string }

/**
 * Result of checking one source: the failure (if any), the faster of the
 * two compiles in CPU milliseconds (user + system of this process, so other
 * programs on a busy machine do not count) and in wall-clock milliseconds,
 * the stitches in the model over every size: the cast-on plus every
 * round's stitches (a round repeated on an unchanged needle counts again,
 * though it shares its stitches; see `modelStitches`), its round
 * records over every size (`rounds`) and the operations the checker
 * carried out over every size (`operations`, StitchLevel.operations).
 */
export interface CaseResult { failure: Failure | null; cpuMs: number; wallMs: number; stitches: number; rounds: number; operations: number }

function cpuNow(): number {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
}

/**
 * The stitches a result's model stands for: per size, the cast-on (the
 * store before the first round, or all of it when no round was worked) plus
 * each round's count. `cast on 1000000` alone is a million stitches of work.
 */
export function modelStitches(result: CompileResult): number {
  let n = 0;
  for (const s of result.sizes) {
    const { rounds, store } = s.stitches;
    n += rounds.length ? rounds[0].offset : store.length;
    for (const r of rounds) n += r.count;
  }
  return n;
}

/** Compiles `source` twice and checks the properties above. Never throws. */
export function checkSource(source: string): CaseResult {
  let first: CompileResult, second: CompileResult;
  let cpuMs = Infinity, wallMs = Infinity;
  const timed = (): CompileResult => {
    const c0 = cpuNow(), w0 = performance.now();
    const r = compile(source);
    wallMs = Math.min(wallMs, performance.now() - w0);
    cpuMs = Math.min(cpuMs, cpuNow() - c0);
    return r;
  };
  try {
    first = timed();
    second = timed();
  } catch (err) {
    const e = err instanceof Error ? err : new Error(String(err));
    return { failure: { kind: 'throw', message: `${e.name}: ${e.message}`, stack: e.stack }, cpuMs, wallMs, stitches: 0, rounds: 0, operations: 0 };
  }
  const stitches = modelStitches(first);
  const rounds = first.sizes.reduce((n, s) => n + s.stitches.rounds.length, 0);
  const operations = first.sizes.reduce((n, s) => n + s.stitches.operations, 0);
  const result = (failure: Failure | null): CaseResult => ({ failure, cpuMs, wallMs, stitches, rounds, operations });
  const starts = lineStarts(source);
  for (const d of first.diagnostics) {
    const p = spanProblem(source, starts, d.span) ?? d.related?.map((r) => spanProblem(source, starts, r.span)).find((x) => x) ?? null;
    if (p) return result({ kind: 'span', message: `${d.code} "${d.message}": ${p}` });
  }
  if (first.ok !== !first.diagnostics.some((d) => d.severity === 'error')) {
    return result({ kind: 'ok-flag', message: `ok is ${first.ok} but the errors say otherwise` });
  }
  const where = firstDifference(first, second);
  if (where !== null) {
    const a = canonicalJson(first), b = canonicalJson(second);
    let i = 0;
    while (i < a.length && a[i] === b[i]) i++;
    const shown = a === b ? 'the CLI JSON agrees' : `JSON offset ${i}: ${a.slice(i, i + 80)} vs ${b.slice(i, i + 80)}`;
    return result({ kind: 'determinism', message: `two compiles differ at result${where} (${shown})` });
  }
  return result(null);
}

/** Throws (for fast-check) when `checkSource` finds a failure; timing is not checked here. */
export function assertSource(source: string): void {
  const { failure } = checkSource(source);
  if (failure) {
    const err = new Error(`${failure.kind}: ${failure.message}`);
    if (failure.stack) err.stack = `${err.message}\ncompiler stack:\n${failure.stack}`;
    throw err;
  }
}

/**
 * The render commands of `npm run loop`:
 *   chart FILE [--size NAME] [--back] [--rounds A-B] [-o out.svg]
 *   instructions FILE [--size NAME]
 *   summary FILE [--size NAME] [--item hat|hand]
 *   plan FILE --rounds A-B [--segment NAME]
 * Exit codes as `check` (notation.md): 0 no error (warnings allowed),
 * 1 the pattern has errors (the output is still written, from what could be
 * worked), 2 usage problem, unreadable file or unknown size.
 */
import { writeFileSync } from 'node:fs';
import { compile, formatDiagnosticText, type CompileResult } from '../../shared/index.ts';
import {
  buildChart, formatInstructionsText, formatPlanText, formatSummaryText, planBacking, renderBackSvg, renderChartSvg, summarize, writeInstructions,
} from '../../shared/render/index.ts';
import { readSource } from './source-file.ts';

/** The commands handled here. */
export const RENDER_COMMANDS = ['chart', 'instructions', 'summary', 'plan'] as const;

const USAGE = [
  'usage: npm run loop -- chart FILE [--size NAME] [--back] [--rounds A-B] [-o out.svg]',
  '       npm run loop -- instructions FILE [--size NAME]',
  '       npm run loop -- summary FILE [--size NAME] [--item hat|hand]',
  '       npm run loop -- plan FILE --rounds A-B [--segment NAME]',
].join('\n');

interface RenderArgs { command: string; file: string; size?: string; back: boolean; out?: string; rounds?: [number, number]; segment?: string; item?: 'hat' | 'hand' }

/** Reads the arguments of a render command; a usage message instead of throwing. */
export function parseRenderArgs(argv: string[]): RenderArgs | { error: string } {
  const [command, ...rest] = argv;
  if (!command || !(RENDER_COMMANDS as readonly string[]).includes(command)) return { error: `unknown command "${command ?? ''}"\n${USAGE}` };
  const args: RenderArgs = { command, file: '', back: false };
  const value = (i: number, flag: string): string | { error: string } => {
    const v = rest[i];
    return v === undefined || v.startsWith('-') ? { error: `${flag} needs a value\n${USAGE}` } : v;
  };
  for (let i = 0; i < rest.length; i++) {
    const a = rest[i];
    const [flag, inline] = a.startsWith('--') && a.includes('=') ? [a.slice(0, a.indexOf('=')), a.slice(a.indexOf('=') + 1)] : [a, undefined];
    const take = (): string | { error: string } => (inline !== undefined ? inline : value(++i, flag));
    if (flag === '--back' && command === 'chart') args.back = true;
    else if (flag === '--size' && command !== 'plan') { const v = take(); if (typeof v !== 'string') return v; args.size = v; }
    else if ((flag === '-o' || flag === '--out') && command === 'chart') { const v = take(); if (typeof v !== 'string') return v; args.out = v; }
    else if (flag === '--segment' && command === 'plan') { const v = take(); if (typeof v !== 'string') return v; args.segment = v; }
    else if (flag === '--item' && command === 'summary') {
      const v = take(); if (typeof v !== 'string') return v;
      if (v !== 'hat' && v !== 'hand') return { error: `--item is hat or hand, not "${v}"\n${USAGE}` };
      args.item = v;
    } else if (flag === '--rounds' && (command === 'plan' || command === 'chart')) {
      const v = take(); if (typeof v !== 'string') return v;
      const m = /^(\d+)-(\d+)$/.exec(v);
      if (!m || Number(m[1]) < 1 || Number(m[2]) < Number(m[1])) return { error: `--rounds takes a range like 12-20, not "${v}"\n${USAGE}` };
      args.rounds = [Number(m[1]), Number(m[2])];
    } else if (a.startsWith('-')) return { error: `unknown option "${a}" for ${command}\n${USAGE}` };
    else if (!args.file) args.file = a;
    else return { error: `one file at a time ("${a}")\n${USAGE}` };
  }
  if (!args.file) return { error: `no file given\n${USAGE}` };
  if (command === 'plan' && !args.rounds) return { error: `plan needs --rounds A-B\n${USAGE}` };
  return args;
}

function problems(file: string, r: CompileResult, err: (s: string) => void): void {
  for (const d of r.diagnostics) if (d.severity === 'error') err(formatDiagnosticText(d, file));
}

/** Runs a render command; returns the exit code. `write` writes a file (replaceable in tests). */
export function runRenderCommand(
  argv: string[], out: (s: string) => void, err: (s: string) => void,
  write: (path: string, text: string) => void = (p, t) => writeFileSync(p, t, 'utf8'),
): number {
  const args = parseRenderArgs(argv);
  if ('error' in args) { err(args.error); return 2; }
  const source = readSource(args.file);
  if (typeof source !== 'string') { err(source.error); return 2; }
  if (args.command === 'plan') {
    const plan = planBacking({ source, first: args.rounds![0], last: args.rounds![1], ...(args.segment ? { segment: args.segment } : {}) });
    out(formatPlanText(plan).trimEnd());
    const compiled = compile(source);
    if (!compiled.ok) { problems(args.file, compiled, err); return 1; }
    return 0;
  }
  const result = compile(source);
  if (args.size !== undefined && !result.sizes.some((s) => s.name === args.size)) {
    err(`${args.file}: the pattern has no size "${args.size}" (sizes: ${result.sizes.map((x) => x.name).join(', ')})`);
    return 2;
  }
  if (!result.ok) problems(args.file, result, err);
  const code = result.ok ? 0 : 1;
  if (args.command === 'chart') {
    const model = buildChart(result, args.size, args.rounds ? { rounds: { first: args.rounds[0], last: args.rounds[1] } } : {});
    if (!model) { err(`${args.file}: nothing to chart`); return Math.max(code, 1); }
    if (model.rows.length === 0) { err(`${args.file}: no rounds in ${args.rounds?.join('-')}`); return 2; }
    const svg = args.back ? renderBackSvg(model) : renderChartSvg(model);
    if (args.out) {
      try { write(args.out, svg); } catch (e) { err(`cannot write ${args.out}: ${(e as Error).message}`); return 2; }
      err(`wrote ${args.out} (size ${model.size}, ${args.back ? 'back of the work' : 'front'})`);
    } else out(svg.trimEnd());
    return code;
  }
  if (args.command === 'instructions') {
    const ins = writeInstructions(source, result, args.size);
    if (!ins) { err(`${args.file}: nothing to write`); return Math.max(code, 1); }
    out(formatInstructionsText(ins).trimEnd());
    return code;
  }
  const sum = summarize(args.size ? { ...result, sizes: result.sizes.filter((s) => s.name === args.size) } : result, args.item ? { item: args.item } : {});
  out(formatSummaryText(sum).trimEnd());
  return code;
}

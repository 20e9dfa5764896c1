/**
 * `npm run loop -- check FILE [--json] [--size NAME]`: compiles a Loopwright
 * source and reports. Exit codes (a contract, notation.md): 0 no error
 * (warnings allowed), 1 errors, 2 usage problem or unreadable file.
 * With --json it prints exactly one JSON object on stdout (toCheckJson).
 * The render commands (chart, instructions, summary, plan) live in render-commands.ts;
 * `diff OLD NEW [--json] [--size NAME]` lives in diff-command.ts.
 */
import { compile, toCheckJson, formatDiagnosticText, type CompileResult } from '../../shared/index.ts';
import { RENDER_COMMANDS, runRenderCommand } from './render-commands.ts';
import { runDiff } from './diff-command.ts';
import { readSource } from './source-file.ts';

const USAGE = 'usage: npm run loop -- check FILE [--json] [--size NAME]';

/** Parsed command line. */
interface Args { command: string; file: string; json: boolean; size?: string }

/** Reads argv; returns a usage message instead of throwing. */
export function parseArgs(argv: string[]): Args | { error: string } {
  const [command, ...rest] = argv;
  if (!command) return { error: USAGE };
  if (command !== 'check') return { error: `unknown command "${command}"\n${USAGE}` };
  let file: string | undefined;
  let json = false;
  let size: string | undefined;
  for (let i = 0; i < rest.length; i++) {
    const a = rest[i];
    if (a === '--json') json = true;
    else if (a === '--size') {
      size = rest[++i];
      if (size === undefined || size.startsWith('--')) return { error: `--size needs a size name\n${USAGE}` };
    } else if (a.startsWith('--size=')) size = a.slice('--size='.length);
    else if (a.startsWith('-')) return { error: `unknown option "${a}"\n${USAGE}` };
    else if (file === undefined) file = a;
    else return { error: `one file at a time ("${a}")\n${USAGE}` };
  }
  if (!file) return { error: `no file given\n${USAGE}` };
  return { command, file, json, size };
}

function textReport(file: string, r: CompileResult): string {
  const lines = r.diagnostics.map((d) => formatDiagnosticText(d, file));
  for (const s of r.sizes) {
    const last = s.rounds[s.rounds.length - 1];
    const word = r.header.construction === 'flat' ? 'rows' : 'rounds';
    lines.push(`size ${s.name}: cast on ${s.castOn}, ${s.rounds.length} ${word}${last ? `, ${last.front} front + ${last.backing} backing stitches at the end` : ''}`);
  }
  const errors = r.diagnostics.filter((d) => d.severity === 'error').length;
  const warnings = r.diagnostics.filter((d) => d.severity === 'warning').length;
  lines.push(`${errors} error${errors === 1 ? '' : 's'}, ${warnings} warning${warnings === 1 ? '' : 's'}`);
  return lines.join('\n');
}

/** Runs the command line; returns the exit code. */
export function main(argv: string[], out: (s: string) => void, err: (s: string) => void): number {
  if ((RENDER_COMMANDS as readonly string[]).includes(argv[0] ?? '')) return runRenderCommand(argv, out, err);
  const args = parseArgs(argv);
  if ('error' in args) { err(args.error); return 2; }
  const source = readSource(args.file);
  if (typeof source !== 'string') { err(source.error); return 2; }
  const result = compile(source, args.size !== undefined ? { size: args.size } : {});
  // Asking for a size the pattern does not have is a usage problem, not a pattern error.
  const unknownSize = result.diagnostics.find((d) => d.code === 'LW208');
  if (unknownSize) { err(`${args.file}: ${unknownSize.message} (${unknownSize.hint ?? ''})`); return 2; }
  out(args.json ? JSON.stringify(toCheckJson(result)) : textReport(args.file, result));
  return result.ok ? 0 : 1;
}

const isEntry = process.argv[1] && import.meta.url === new URL(`file://${process.argv[1]}`).href;
if (isEntry) {
  const argv = process.argv.slice(2);
  const out = (s: string) => { process.stdout.write(`${s}\n`); };
  const err = (s: string) => { process.stderr.write(`${s}\n`); };
  // diff reads two files asynchronously, so it is dispatched here rather than in the synchronous main().
  process.exitCode = argv[0] === 'diff' ? await runDiff(argv.slice(1), { out, err }) : main(argv, out, err);
}

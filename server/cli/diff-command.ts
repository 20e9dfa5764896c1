/**
 * `npm run loop -- diff OLD NEW [--json] [--size NAME]`: the semantic diff
 * of two revisions of a Loopwright source (shared/diff), then the line diff.
 * Exit codes as for `check` (notation.md): 0 when both revisions compile
 * without errors, 1 when either has errors, 2 on a usage problem or an
 * unreadable file. With --json it prints exactly one JSON object on stdout:
 * the `RevisionDiff` of shared/diff/types.ts (the same object
 * `GET /api/patterns/:id/diff` returns).
 */
import { compile } from '../../shared/index.ts';
import { diffCompiled, formatDiffText } from '../../shared/diff/index.ts';
import { readSource } from './source-file.ts';

const USAGE = 'usage: npm run loop -- diff OLD.loop NEW.loop [--json] [--size NAME]';

/** Parsed arguments of the diff command. */
export interface DiffArgs { oldFile: string; newFile: string; json: boolean; size?: string }

/** Reads the arguments after the word `diff`; returns a usage message instead of throwing. */
export function parseDiffArgs(argv: readonly string[]): DiffArgs | { error: string } {
  const files: string[] = [];
  let json = false;
  let size: string | undefined;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--json') json = true;
    else if (a === '--size') {
      size = argv[++i];
      if (size === undefined || size.startsWith('--')) return { error: `--size needs a size name\n${USAGE}` };
    } else if (a.startsWith('--size=')) size = a.slice('--size='.length);
    else if (a.startsWith('-') && a !== '-') return { error: `unknown option "${a}"\n${USAGE}` };
    else files.push(a);
  }
  if (files.length !== 2) return { error: `diff takes two files, got ${files.length}\n${USAGE}` };
  return { oldFile: files[0], newFile: files[1], json, ...(size !== undefined ? { size } : {}) };
}

/** Where the command writes; defaults to the process's streams. */
export interface DiffIo { out(s: string): void; err(s: string): void }

const processIo: DiffIo = {
  out: (s) => { process.stdout.write(`${s}\n`); },
  err: (s) => { process.stderr.write(`${s}\n`); },
};

/**
 * Runs the diff command on the arguments after the word `diff`; returns
 * the exit code (0 ok, 1 either revision has errors, 2 usage or unreadable).
 */
export async function runDiff(argv: readonly string[], io: DiffIo = processIo): Promise<number> {
  const args = parseDiffArgs(argv);
  if ('error' in args) { io.err(args.error); return 2; }
  const [oldSource, newSource] = [readSource(args.oldFile), readSource(args.newFile)];
  if (typeof oldSource !== 'string') { io.err(oldSource.error); return 2; }
  if (typeof newSource !== 'string') { io.err(newSource.error); return 2; }
  const opts = args.size !== undefined ? { size: args.size } : {};
  const oldResult = compile(oldSource, opts), newResult = compile(newSource, opts);
  // A size neither revision has is a usage problem; a size only one has is a real difference.
  if (args.size !== undefined && oldResult.sizes.length === 0 && newResult.sizes.length === 0) {
    const known = [...new Set([...oldResult.header.sizes, ...newResult.header.sizes])].join(' ');
    io.err(`neither revision has a size ${args.size} (sizes: ${known})`);
    return 2;
  }
  const diff = diffCompiled(oldSource, oldResult, newSource, newResult, opts);
  io.out(args.json ? JSON.stringify(diff) : `--- ${args.oldFile}\n+++ ${args.newFile}\n${formatDiffText(diff)}`);
  return diff.old.ok && diff.new.ok ? 0 : 1;
}

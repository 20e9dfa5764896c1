/**
 * Measures the gzipped JavaScript each part of the studio loads, from the
 * build's manifest (dist/.vite/manifest.json):
 * - first load: the entry with its static imports, plus the sign-in and
 *   library pages (lazy route modules) with theirs;
 * - workspace: the entry closure plus the workspace page closure, its
 *   lazily loaded views (not the conflict dialog, loaded only on a 409,
 *   nor find/replace, loaded on first Mod-F), and the compile worker with
 *   every chunk it imports (the chart and instructions renderers it loads
 *   when those panes open);
 * - workspace on opening: the same without the renderers' chunk;
 * - summary pane: its component and the separate worker it starts on
 *   first open (reported apart; the budget names editor, compiler worker
 *   and chart).
 * Budgets (issue 6): 150 KB and 300 KB (1 KB = 1024 bytes).
 *
 * Run after `vite build`: `npx tsx tests/e2e/bundle-size.ts` prints JSON.
 * Exported for the benchmark runner.
 */
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';

interface ManifestChunk { file: string; src?: string; isEntry?: boolean; isDynamicEntry?: boolean; imports?: string[]; dynamicImports?: string[] }
type Manifest = Record<string, ManifestChunk>;

/** Sizes in bytes (gzip level 9 as a server would send them) and the files counted. */
export interface BundleSizes {
  firstLoadGzip: number;
  workspaceGzip: number;
  workspaceOnOpenGzip: number;
  summaryPaneGzip: number;
  firstLoadFiles: string[];
  workspaceFiles: string[];
  budgets: { firstLoadGzip: number; workspaceGzip: number };
}

export const BUDGETS = { firstLoadGzip: 150 * 1024, workspaceGzip: 300 * 1024 };

function closure(manifest: Manifest, keys: string[], out = new Set<string>()): Set<string> {
  for (const key of keys) {
    const chunk = manifest[key];
    if (!chunk || out.has(chunk.file)) continue;
    out.add(chunk.file);
    closure(manifest, chunk.imports ?? [], out);
  }
  return out;
}

function gz(distDir: string, files: Iterable<string>): number {
  let total = 0;
  for (const f of files) if (f.endsWith('.js')) total += gzipSync(readFileSync(path.join(distDir, f)), { level: 9 }).length;
  return total;
}

/** Measures dist/ (default `<repo>/dist`). Throws when there is no build. */
export function measureBundles(distDir = path.resolve(import.meta.dirname, '..', '..', 'dist')): BundleSizes {
  const manifestFile = path.join(distDir, '.vite', 'manifest.json');
  if (!existsSync(manifestFile)) throw new Error(`no build manifest at ${manifestFile}; run vite build first`);
  const manifest = JSON.parse(readFileSync(manifestFile, 'utf8')) as Manifest;
  const entry = Object.keys(manifest).find((k) => manifest[k].isEntry);
  if (!entry) throw new Error('the manifest has no entry chunk');
  const page = (name: string) => {
    const key = Object.keys(manifest).find((k) => k.endsWith(`src/routes/${name}.tsx`));
    if (!key) throw new Error(`page ${name} is not in the build`);
    return key;
  };
  const first = closure(manifest, [entry, page('SignIn'), page('Library')]);
  const workspaceKey = page('Workspace');
  // Views the workspace loads on demand count too (chart, instructions), except
  // the conflict dialog, which loads only when a save meets a newer revision.
  const views = (manifest[workspaceKey].dynamicImports ?? []).filter((k) => k.includes('src/') && !/ConflictDialog|SummaryPane/.test(k));
  const workspace = closure(manifest, [entry, workspaceKey, ...views]);
  const assets = path.join(distDir, 'assets');
  const js = readdirSync(assets).filter((f) => f.endsWith('.js'));
  const workers = js.filter((f) => /^compile\.worker/.test(f)).map((f) => `assets/${f}`);
  const summaryWorker = js.filter((f) => /^(summary\.worker|SummaryPane)-/.test(f)).map((f) => `assets/${f}`);
  const onOpen = new Set([...workspace, ...workers]);
  // The worker bundle is not in the manifest: follow its own imports.
  const queue = [...workers];
  while (queue.length) {
    const file = queue.pop()!;
    if (workspace.has(file)) continue;
    workspace.add(file);
    const code = readFileSync(path.join(distDir, file), 'utf8');
    for (const m of code.matchAll(/(?:import\(\s*[`'"]|from\s*[`'"])\.\/([\w.-]+\.js)/g)) queue.push(`assets/${m[1]}`);
  }

  return {
    firstLoadGzip: gz(distDir, first),
    workspaceGzip: gz(distDir, workspace),
    workspaceOnOpenGzip: gz(distDir, onOpen),
    summaryPaneGzip: gz(distDir, summaryWorker),
    firstLoadFiles: [...first],
    workspaceFiles: [...workspace],
    budgets: BUDGETS,
  };
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(import.meta.filename)) {
  console.log(JSON.stringify(measureBundles(), null, 2));
}

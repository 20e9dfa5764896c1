/**
 * Idempotent demo seed for local runs (`npm start`): the invented Saltmarsh
 * Knits accounts and, owned by the designer, one pattern per
 * `examples/*.loop` file with revision 1 (compile summary computed here).
 * Running it again changes nothing: accounts are matched by e-mail, patterns
 * by owner and title. Local demo data only.
 */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import bcrypt from 'bcryptjs';
import { Pattern, Revision, User, type GlobalRole } from '../models/index.ts';
import type { Sequelize } from 'sequelize';
import { summarizeSource, titleFromSource } from '../services/compile-summary.ts';

/** Password of every demo account (local demo data only). */
export const DEMO_PASSWORD = 'saltmarsh-demo';

/** The demo accounts of the scenario in product.md. */
export const DEMO_ACCOUNTS: readonly { email: string; name: string; roles: GlobalRole[]; note: string }[] = [
  { email: 'designer@saltmarsh.example', name: 'Maren Tolley', roles: ['designer'], note: 'designer' },
  { email: 'editor@saltmarsh.example', name: 'Idris Penhale', roles: ['editor'], note: 'technical editor' },
  { email: 'knitter@saltmarsh.example', name: 'Sorrel Quayle', roles: ['knitter'], note: 'knitter' },
  { email: 'knitter2@saltmarsh.example', name: 'Bram Ottery', roles: ['knitter'], note: 'test knitter' },
];

const repoRoot = path.resolve(import.meta.dirname, '..', '..');

function titleFromFileName(file: string): string {
  return path.basename(file, '.loop').split(/[-_ ]+/).filter(Boolean).map((w) => w[0]!.toUpperCase() + w.slice(1)).join(' ');
}

/** The message of a demo pattern's revision 1 (how changedDemoExamples knows the pattern came from the file). */
const demoMessage = (file: string) => `Demo pattern from examples/${file}`;

/** The example files (`.loop`) of a folder, sorted; none when it cannot be read. */
function exampleFiles(dir: string): string[] {
  try {
    return readdirSync(dir).filter((f) => f.endsWith('.loop')).sort();
  } catch {
    return [];
  }
}

/**
 * Example files whose demo pattern was seeded from an earlier text of the
 * file: the pattern's revision 1 says it came from that file and its source
 * differs from the file now. The seed never rewrites a pattern (revisions
 * are history), so `npm start` names these and points at `npm run
 * demo:reset`.
 */
export async function changedDemoExamples(opts: { examplesDir?: string } = {}): Promise<string[]> {
  const designer = await User.findOne({ where: { email: 'designer@saltmarsh.example' } });
  if (!designer) return [];
  const dir = opts.examplesDir ?? path.join(repoRoot, 'examples');
  const changed: string[] = [];
  for (const file of exampleFiles(dir)) {
    const source = readFileSync(path.join(dir, file), 'utf8');
    const title = titleFromSource(source) ?? titleFromFileName(file);
    const pattern = await Pattern.findOne({ where: { ownerId: designer.id, title } });
    if (!pattern) continue;
    const first = await Revision.findOne({ where: { patternId: pattern.id, number: 1 } });
    if (first && first.message === demoMessage(file) && first.source !== source) changed.push(file);
  }
  return changed;
}

/** Seeds demo accounts and example patterns; returns what it created. */
export async function seedDemo(sequelize: Sequelize, opts: { examplesDir?: string; bcryptCost?: number } = {}): Promise<{ users: number; patterns: number }> {
  let users = 0;
  let patterns = 0;
  const byEmail = new Map<string, User>();
  for (const account of DEMO_ACCOUNTS) {
    let user = await User.findOne({ where: { email: account.email } });
    if (!user) {
      const passwordHash = await bcrypt.hash(DEMO_PASSWORD, Math.max(10, opts.bcryptCost ?? 10));
      user = await User.create({ email: account.email, name: account.name, passwordHash, roles: account.roles });
      users++;
    }
    byEmail.set(account.email, user);
  }
  const designer = byEmail.get('designer@saltmarsh.example')!;

  const dir = opts.examplesDir ?? path.join(repoRoot, 'examples');
  for (const file of exampleFiles(dir)) {
    const source = readFileSync(path.join(dir, file), 'utf8');
    const title = titleFromSource(source) ?? titleFromFileName(file);
    if (await Pattern.findOne({ where: { ownerId: designer.id, title } })) continue;
    await sequelize.transaction(async (transaction) => {
      const pattern = await Pattern.create({ ownerId: designer.id, title, latestRevision: 1 }, { transaction });
      const { summary, errors, warnings } = summarizeSource(source);
      await Revision.create({ patternId: pattern.id, number: 1, source, authorId: designer.id, message: demoMessage(file), summary, errors, warnings }, { transaction });
    });
    patterns++;
  }
  return { users, patterns };
}

/**
 * `npm test`: one command, one exit code, one closing line.
 *
 * Starts a private MariaDB for tests (its own directory and port, never the
 * demo data), runs migrations, then runs in order: typecheck, lint, the
 * Vitest suites (shared + reference, api, e2e). Each Vitest suite writes a
 * JSON report; typecheck and lint count as one check each. The last line is
 * `N passed, N failed`, which CI reads.
 */
import { spawn } from 'node:child_process';
import { mkdirSync, readFileSync, existsSync, rmSync } from 'node:fs';
import path from 'node:path';
import { startPrivateMariaDB, type PrivateMariaDB } from '../server/db/launcher.ts';

const root = path.resolve(import.meta.dirname, '..');
const reportDir = path.join(root, '.data', `${process.env.LOOPWRIGHT_TEST_NAME ?? 'test'}-reports`);

interface StepResult { name: string; passed: number; failed: number }

function run(cmd: string, args: string[], env: NodeJS.ProcessEnv): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { cwd: root, env, stdio: 'inherit' });
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
    child.on('error', () => resolve(127));
  });
}

const bin = (name: string) => path.join(root, 'node_modules', '.bin', name);

async function vitestSuite(name: string, dirs: string[], env: NodeJS.ProcessEnv, sequential: boolean): Promise<StepResult> {
  const present = dirs.filter((d) => existsSync(path.join(root, d)));
  const out = path.join(reportDir, `${name}.json`);
  rmSync(out, { force: true });
  const args = ['run', ...present, '--reporter=default', '--reporter=json', `--outputFile.json=${out}`, '--passWithNoTests'];
  if (sequential) args.push('--no-file-parallelism');
  console.log(`\n── ${name}: vitest ${present.join(' ')}`);
  const code = await run(bin('vitest'), args, env);
  if (!existsSync(out)) return { name, passed: 0, failed: 1 };
  const report = JSON.parse(readFileSync(out, 'utf8')) as {
    numPassedTests: number; numFailedTests: number; numTotalTestSuites: number;
    testResults?: { status: string; assertionResults: unknown[] }[];
  };
  // A file that fails to load (syntax error, failing hook) has no assertion
  // results; count it as a failure so it can never pass silently.
  const brokenFiles = (report.testResults ?? []).filter((f) => f.status === 'failed' && f.assertionResults.length === 0).length;
  let failed = report.numFailedTests + brokenFiles;
  if (code !== 0 && failed === 0) failed = 1;
  return { name, passed: report.numPassedTests, failed };
}

async function main(): Promise<number> {
  mkdirSync(reportDir, { recursive: true });
  const results: StepResult[] = [];
  let db: PrivateMariaDB | undefined;
  const stopDb = async () => { if (db) { const d = db; db = undefined; await d.stop(); } };
  process.on('SIGINT', () => { void stopDb().then(() => process.exit(130)); });
  process.on('SIGTERM', () => { void stopDb().then(() => process.exit(143)); });
  try {
    console.log('── starting the private test database');
    // LOOPWRIGHT_TEST_NAME / LOOPWRIGHT_TEST_DB_PORT let two runs share a machine (own directory, own port).
    const name = process.env.LOOPWRIGHT_TEST_NAME ?? 'test';
    if (!/^test[a-z0-9-]*$/.test(name)) throw new Error(`LOOPWRIGHT_TEST_NAME must start with "test" (got ${name})`);
    db = await startPrivateMariaDB({ name, port: Number(process.env.LOOPWRIGHT_TEST_DB_PORT ?? 3317) });
    const env: NodeJS.ProcessEnv = {
      ...process.env,
      NODE_ENV: 'test',
      LOOPWRIGHT_DATA_DIR: path.join(root, '.data', name),
      DB_HOST: db.host,
      DB_PORT: String(db.port),
      DB_USER: db.user,
      DB_PASSWORD: db.password,
      DB_NAME: db.database,
      JWT_SECRET: process.env.JWT_SECRET ?? 'loopwright-test-secret-not-for-production',
    };

    // `npm test -- tests/e2e/account.test.ts ...` runs only the named files
    // (one at a time, against the private database) and skips the rest.
    const only = process.argv.slice(2).filter((a) => !a.startsWith('-'));
    if (only.length > 0) {
      results.push(await vitestSuite('selected', only, env, true));
    } else {
      await runAll(results, env);
    }
  } catch (err) {
    console.error('test run could not start:', err instanceof Error ? err.message : err);
    results.push({ name: 'setup', passed: 0, failed: 1 });
  } finally {
    await stopDb();
  }
  return finish(results);
}

async function runAll(results: StepResult[], env: NodeJS.ProcessEnv): Promise<void> {
  console.log('\n── typecheck: tsc --noEmit');
  const tsc = await run(bin('tsc'), ['--noEmit', '-p', 'tsconfig.json'], env);
  results.push({ name: 'typecheck', passed: tsc === 0 ? 1 : 0, failed: tsc === 0 ? 0 : 1 });

  console.log('\n── lint: eslint .');
  const lint = await run(bin('eslint'), ['.'], env);
  results.push({ name: 'lint', passed: lint === 0 ? 1 : 0, failed: lint === 0 ? 0 : 1 });

  results.push(await vitestSuite('shared', ['tests/shared', 'tests/reference'], env, false));
  results.push(await vitestSuite('api', ['tests/api'], env, true));
  results.push(await vitestSuite('e2e', ['tests/e2e'], env, true));
}

function finish(results: StepResult[]): number {
  console.log('\n── summary');
  for (const r of results) console.log(`  ${r.name.padEnd(10)} ${r.passed} passed, ${r.failed} failed`);
  const passed = results.reduce((a, r) => a + r.passed, 0);
  const failed = results.reduce((a, r) => a + r.failed, 0);
  console.log(`${passed} passed, ${failed} failed`);
  return failed === 0 && passed > 0 ? 0 : 1;
}

main().then((code) => process.exit(code), (err) => { console.error(err); console.log('0 passed, 1 failed'); process.exit(1); });

/**
 * Child process of the bench's capacity part (capacity.ts): revision saves
 * as designers make them, each client saving its own pattern one save after
 * another (the base of each save is the revision the previous one made, so
 * every save is a real new revision, not a 409). Run in its own process so
 * the load does not share the app's event loop.
 *
 * Argument: JSON `{url, seconds, auth, patterns: [{id, base}], source}`.
 * Prints one JSON line: saves, elapsed seconds, answers other than 201, and
 * the response time of every save (ms).
 */
export {};

interface SaveArgs { url: string; seconds: number; auth: string; patterns: { id: number; base: number }[]; source: string }

const args = JSON.parse(process.argv[2] ?? '{}') as SaveArgs;
const times: number[] = [];
let other = 0;
const started = performance.now();
const deadline = started + args.seconds * 1000;

async function client(p: { id: number; base: number }): Promise<void> {
  let n = 0;
  while (performance.now() < deadline) {
    // A small real change per save: a comment line says which save it is.
    const source = `${args.source}\n# save ${++n}\n`;
    const t = performance.now();
    const res = await fetch(`${args.url}/api/patterns/${p.id}/revisions`, {
      method: 'POST',
      headers: { authorization: args.auth, 'content-type': 'application/json' },
      body: JSON.stringify({ source, baseRevision: p.base, message: `bench save ${n}` }),
    });
    const body = await res.json() as { revision?: { number: number } };
    if (res.status === 201 && body.revision) {
      times.push(performance.now() - t);
      p.base = body.revision.number;
    } else other++;
  }
}

await Promise.all(args.patterns.map(client));
process.stdout.write(JSON.stringify({ saves: times.length, seconds: (performance.now() - started) / 1000, other, times: times.map((t) => Math.round(t * 100) / 100) }) + '\n');

/**
 * Child process of the bench's HTTP figure (api.ts): one autocannon load,
 * run in its own process so the load generator does not share the app's
 * event loop. Prints one JSON line: autocannon's own summary plus the
 * response time of every 2xx answer (ms), so the parent can pool the
 * answers of several rounds into one distribution.
 *
 * Argument: JSON `{url, seconds, connections, headers}`.
 */
import autocannon from 'autocannon';

interface LoadArgs { url: string; seconds: number; connections: number; headers: Record<string, string> }

const args = JSON.parse(process.argv[2] ?? '{}') as LoadArgs;
const times: number[] = [];
const instance = autocannon({ url: args.url, duration: args.seconds, connections: args.connections, headers: args.headers }, (err, result) => {
  if (err) {
    console.error(err instanceof Error ? err.message : String(err));
    process.exit(1);
  }
  process.stdout.write(JSON.stringify({
    p50: result.latency.p50, p99: result.latency.p99, requestsPerSecond: result.requests.average, requests: result.requests.total,
    non2xx: result.non2xx, errors: result.errors + result.timeouts, times: times.map((t) => Math.round(t * 100) / 100),
  }) + '\n');
});
instance.on('response', (_client, statusCode, _bytes, responseTime) => {
  if (statusCode >= 200 && statusCode < 300) times.push(responseTime);
});

import autocannon, { type Options, type Request as CannonRequest } from 'autocannon';

export interface LoadFigures {
  rps: number;
  p50: number;
  p95: number;
  p99: number;
  requests: number;
  non2xx: number;
  errors: number;
  connections: number;
  seconds: number;
}

const percentile = (sorted: number[], p: number) =>
  sorted.length ? sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]! : NaN;

/**
 * One fixed-time autocannon run. Latencies are kept per response, so p95 is exact (autocannon's own summary has
 * p90 and p97.5 but no p95). Each connection gets its own headers (a tablet's cookies and CSRF token).
 */
export async function load(options: {
  url: string;
  connections: number;
  seconds: number;
  headersFor: (connection: number) => Record<string, string>;
  requests: CannonRequest[];
}): Promise<LoadFigures> {
  const times: number[] = [];
  let connection = 0;
  const opts: Options = {
    url: options.url,
    connections: options.connections,
    duration: options.seconds,
    requests: options.requests,
    setupClient: (client) => {
      client.setHeaders(options.headersFor(connection++));
    },
  };
  let instance: autocannon.Instance | undefined;
  const finished = new Promise<autocannon.Result>((ok, fail) => {
    instance = autocannon(opts, (err, result) => (err ? fail(err) : ok(result)));
  });
  instance!.on('response', (_client, statusCode, _bytes, ms) => {
    if (statusCode >= 200 && statusCode < 300) times.push(ms);
  });
  const result = await finished;
  times.sort((a, b) => a - b);
  const round = (n: number) => Math.round(n * 10) / 10;
  return {
    rps: round(times.length / options.seconds),
    p50: round(percentile(times, 50)),
    p95: round(percentile(times, 95)),
    p99: round(percentile(times, 99)),
    requests: result.requests.total,
    non2xx: result.non2xx,
    errors: result.errors + result.timeouts,
    connections: options.connections,
    seconds: options.seconds,
  };
}

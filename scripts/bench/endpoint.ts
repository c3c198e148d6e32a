import { randomUUID } from 'node:crypto';
import autocannon, { type RequestOptions } from 'autocannon';

// Drives POST /api/attempts with autocannon; every request gets its own clientId, so every one is a
// new attempt (a repeated clientId would be answered from the stored row without scoring).

export interface AttemptBody {
  procedure: string;
  stage: string;
  answer: unknown;
}

/** Who a request is sent as: the app reads the session cookie, the baseline the learner's id in a header. */
export interface Sender {
  headers: Record<string, string>;
}

export interface LoadOptions {
  label: string;
  origin: string;
  /** Requests go to these in turn: one learner, or a class of them. */
  senders: Sender[];
  connections: number;
  seconds: number;
  bodies: AttemptBody[];
  /** Rows of the benchmark learner in `attempts`, counted before and after the run. */
  countRows: () => Promise<number>;
}

export interface LoadResult {
  label: string;
  requestsPerSec: number;
  p50: number;
  p99: number;
  total: number;
  non2xx: number;
  errors: number;
  timeouts: number;
  statusCodes: Record<string, number>;
  rowsWritten: number;
}

function requestFor(options: Pick<LoadOptions, 'senders' | 'bodies'>): RequestOptions {
  let next = 0;
  return {
    method: 'POST',
    path: '/api/attempts',
    setupRequest: (request) => {
      const sender = options.senders[next % options.senders.length]!;
      const body = options.bodies[next % options.bodies.length]!;
      next += 1;
      return { ...request, headers: { 'content-type': 'application/json', ...sender.headers }, body: JSON.stringify({ ...body, clientId: randomUUID() }) };
    },
  };
}

/** One request outside autocannon, so a refusal shows its body instead of only a status code. */
export async function preflight(options: Pick<LoadOptions, 'label' | 'origin' | 'senders' | 'bodies'>): Promise<void> {
  const response = await fetch(`${options.origin}/api/attempts`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', ...options.senders[0]!.headers },
    body: JSON.stringify({ ...options.bodies[0], clientId: randomUUID() }),
  });
  if (response.status !== 201) {
    throw new Error(`${options.label}: a single POST /api/attempts answered ${response.status}: ${(await response.text()).slice(0, 500)}`);
  }
}

export async function runLoad(options: LoadOptions): Promise<LoadResult> {
  const before = await options.countRows();
  const result = await autocannon({
    url: options.origin,
    connections: options.connections,
    duration: options.seconds,
    timeout: 10,
    requests: [requestFor(options)],
  });
  const rowsWritten = (await options.countRows()) - before;
  const statusCodes = Object.fromEntries(Object.entries(result.statusCodeStats).map(([code, s]) => [code, Number(s.count)]));
  return {
    label: options.label,
    requestsPerSec: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    total: Object.values(statusCodes).reduce((a, b) => a + b, 0),
    non2xx: result.non2xx,
    errors: result.errors,
    timeouts: result.timeouts,
    statusCodes,
    rowsWritten,
  };
}

// The parts of autocannon's programmatic API this benchmark uses (the package ships no types).
declare module 'autocannon' {
  export interface RequestOptions {
    method?: string;
    path?: string;
    headers?: Record<string, string>;
    body?: string;
    setupRequest?: (request: RequestOptions, context: Record<string, unknown>) => RequestOptions;
  }
  export interface Options {
    url: string;
    connections?: number;
    duration?: number;
    timeout?: number;
    method?: string;
    headers?: Record<string, string>;
    requests?: RequestOptions[];
  }
  export interface Histogram {
    average: number;
    p50: number;
    p99: number;
    max: number;
  }
  export interface Result {
    requests: Histogram & { total: number };
    latency: Histogram;
    duration: number;
    errors: number;
    timeouts: number;
    non2xx: number;
    '2xx': number;
    statusCodeStats: Record<string, { count: number }>;
  }
  export default function autocannon(options: Options): Promise<Result>;
}

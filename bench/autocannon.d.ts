// The part of autocannon's API the benchmark uses (the package ships no types).
declare module 'autocannon' {
  interface Request {
    method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
    path?: string;
    headers?: Record<string, string>;
    body?: string;
    setupRequest?: (req: Record<string, unknown>) => Record<string, unknown>;
  }
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    method?: string;
    headers?: Record<string, string>;
    body?: string;
    requests?: Request[];
  }
  interface Histogram {
    average: number;
    mean: number;
    p50: number;
    p90: number;
    p99: number;
    max: number;
    total: number;
  }
  interface Result {
    requests: Histogram;
    latency: Histogram;
    throughput: Histogram;
    errors: number;
    timeouts: number;
    non2xx: number;
    duration: number;
  }
  function autocannon(opts: Options): Promise<Result>;
  export default autocannon;
}

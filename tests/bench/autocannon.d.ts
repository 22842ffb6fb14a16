// The part of autocannon's API the benchmarks use (the package ships no types).
declare module 'autocannon' {
  namespace autocannon {
    type Request = { method?: string; path?: string; headers?: Record<string, string>; body?: string };
    type RequestSpec = Request & {
      setupRequest?: (req: Request, context: Record<string, unknown>) => Request;
      onResponse?: (status: number, body: string, context: Record<string, unknown>) => void;
    };
    type Options = { url: string; connections?: number; duration?: number; amount?: number; timeout?: number; headers?: Record<string, string>; requests?: RequestSpec[] };
    type Histogram = { average: number; p50: number; p99: number; max: number; total: number };
    type Result = { requests: Histogram; latency: Histogram; throughput: Histogram; errors: number; timeouts: number; non2xx: number };
  }
  function autocannon(opts: autocannon.Options): Promise<autocannon.Result>;
  export = autocannon;
}

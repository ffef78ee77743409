/** Types for the parts of `autocannon` the API benchmark uses (the package ships none; shape per its README). */
declare module 'autocannon' {
  namespace autocannon {
    interface Request {
      method?: 'GET' | 'POST' | 'PUT' | 'DELETE';
      path: string;
      headers?: Record<string, string>;
      body?: string;
    }
    interface Options {
      url: string;
      connections?: number;
      duration?: number;
      overallRate?: number;
      headers?: Record<string, string>;
      requests?: Request[];
    }
    interface Histogram {
      p50: number;
      p90: number;
      p99: number;
      max: number;
      mean: number;
    }
    interface Result {
      requests: Histogram & { total: number };
      latency: Histogram;
      errors: number;
      timeouts: number;
      non2xx: number;
    }
    interface Instance {
      stop(): void;
    }
  }
  function autocannon(options: autocannon.Options, done: (err: Error | null, result: autocannon.Result) => void): autocannon.Instance;
  export = autocannon;
}

// autocannon 9 ships no types; only what tests/bench/load.bench.ts uses.
declare module 'autocannon' {
  type Options = { url: string; method?: string; headers?: Record<string, string>; body?: string; connections?: number; duration?: number };
  type Histogram = { average: number; p50: number; p99: number };
  type Result = { latency: Histogram; requests: Histogram; non2xx: number; errors: number };
  export default function autocannon(opts: Options): Promise<Result>;
}

// The part of autocannon 8's API the bench uses (the package ships no types).
declare module "autocannon" {
  interface Options {
    url: string;
    headers?: Record<string, string>;
    connections?: number;
    duration?: number;
  }
  interface Histogram {
    average: number;
    p50: number;
    p99: number;
  }
  interface Result {
    requests: Histogram;
    latency: Histogram;
    errors: number;
    timeouts: number;
    non2xx: number;
    "2xx": number;
    "3xx": number;
    "4xx": number;
    "5xx": number;
  }
  export default function autocannon(opts: Options): Promise<Result>;
}

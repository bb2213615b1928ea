/** The part of autocannon's API that scripts/bench-api.ts uses (the package ships no types). */
declare module "autocannon" {
  interface Options {
    url: string | string[];
    method?: "GET" | "POST" | "PUT" | "DELETE";
    body?: string;
    headers?: Record<string, string>;
    connections?: number;
    overallRate?: number;
    duration?: number;
    timeout?: number;
  }
  interface Result {
    duration: number;
    errors: number;
    timeouts: number;
    non2xx: number;
  }
  interface Instance extends PromiseLike<Result> {
    on(event: "response", listener: (client: unknown, statusCode: number, resBytes: number, responseTime: number) => void): this;
    stop(): void;
  }
  function autocannon(opts: Options): Instance;
  export default autocannon;
}

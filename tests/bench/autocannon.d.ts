/** The part of autocannon 9 the API load bench uses (the package ships no types). */
declare module "autocannon" {
  import type { EventEmitter } from "node:events";
  interface Options {
    url: string;
    method?: string;
    connections?: number;
    duration?: number;
    timeout?: number;
    headers?: Record<string, string>;
    body?: string;
    setupClient?: (client: EventEmitter) => void;
  }
  interface Result {
    requests: { total: number };
    errors: number;
    timeouts: number;
  }
  export default function autocannon(options: Options): Promise<Result>;
}

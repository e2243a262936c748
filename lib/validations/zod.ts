/**
 * zod, configured once for the server and the browser. `jitless`: zod 4 otherwise probes `new Function`
 * to compile fast parsers, which the Content-Security-Policy (no 'unsafe-eval', see
 * lib/security-headers.ts) reports as a violation on every page with a form. Every schema imports z from here.
 */
import { z } from "zod";

z.config({ jitless: true });

export { z };

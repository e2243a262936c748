// A thread of the offline checker run from the TypeScript sources (`--parallel N` without the single-file bundle):
// loads tsx's loader in this thread, then the checker's module, which answers the parts it is given (lib/core/cli-parts.ts).
const { register } = await import("tsx/esm/api");
register();
await import(new URL("../lib/core/cli.ts", import.meta.url).href);

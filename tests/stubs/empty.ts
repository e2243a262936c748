// Stands in for the `server-only` marker package under Vitest, where there is no React Server bundle.
export {};

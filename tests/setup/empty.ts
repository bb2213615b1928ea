// Stands in for the "server-only" guard package under vitest (which is not a React server).
export {};

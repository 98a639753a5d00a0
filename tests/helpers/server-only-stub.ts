// Stand-in for the `server-only` marker package under vitest, where every module runs on the server.
export {};

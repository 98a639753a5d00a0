// Types of postgres-cluster.mjs, for the TypeScript scripts that start a throwaway cluster (npm run bench:queue).
export function findPostgresBin(): string | null;
export function freePort(): Promise<number>;
export function startPostgresCluster(): Promise<{ url: string; stop: () => void }>;

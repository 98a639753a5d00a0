// Every test file gets its own throwaway in-memory database: the live .data folder is never touched.
process.env.RAREFACT_DATA_DIR = "memory://";
process.env.BETTER_AUTH_SECRET = "test-secret-that-is-long-enough-for-hmac-0123456789";
process.env.BETTER_AUTH_URL = "http://localhost:3000";
delete process.env.DATABASE_URL;

export {};

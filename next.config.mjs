/** @type {import('next').NextConfig} */
const nextConfig = {
  // Cross-origin isolation lets the solver share memory between Web Workers (SharedArrayBuffer).
  // The headers reach /_next/static too, so worker scripts are served isolated as well.
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "Cross-Origin-Opener-Policy", value: "same-origin" },
          { key: "Cross-Origin-Embedder-Policy", value: "require-corp" },
          { key: "X-Content-Type-Options", value: "nosniff" },
          { key: "Referrer-Policy", value: "same-origin" },
        ],
      },
    ];
  },
  // PGlite loads its WebAssembly and data files from node_modules as in plain Node.
  serverExternalPackages: ["@electric-sql/pglite"],
  poweredByHeader: false,
};

export default nextConfig;

import { readdirSync, readFileSync } from "node:fs";
import { join, relative, sep } from "node:path";
import { describe, expect, it } from "vitest";
import * as openApiRoute from "@/app/api/openapi.json/route";
import { apiOperations } from "@/lib/server/openapi/operations";

// The OpenAPI document may not drift from the code: every method a route file exports has an
// operation, every operation has its route, and the document is sound (every $ref resolves, path
// parameters match the path, operation ids are unique).

const apiRoot = join(process.cwd(), "app", "api");
/** better-auth's catch-all is its own API (sign-up, sign-in, sessions), not Rarefact's. */
const undocumented = new Set(["/api/auth/{all}"]);
const httpMethods = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;

function routeFiles(folder: string): string[] {
  return readdirSync(folder, { withFileTypes: true }).flatMap((entry) => {
    const path = join(folder, entry.name);
    if (entry.isDirectory()) return routeFiles(path);
    return entry.name === "route.ts" ? [path] : [];
  });
}

/** app/api/studies/[studyId]/route.ts -> /api/studies/{studyId} */
function openApiPath(file: string): string {
  const segments = relative(join(process.cwd(), "app"), file).split(sep).slice(0, -1);
  return `/${segments.map((segment) => segment.replace(/^\[(?:\.\.\.)?(.+)\]$/, "{$1}")).join("/")}`;
}

function exportedMethods(source: string): string[] {
  return httpMethods.filter((method) => new RegExp(`export\\s+(const|async\\s+function|function)\\s+${method}\\b`).test(source));
}

const routes = routeFiles(apiRoot).map((file) => {
  const source = readFileSync(file, "utf8");
  return { file: relative(process.cwd(), file), path: openApiPath(file), methods: exportedMethods(source), source };
});

async function servedDocument(): Promise<Record<string, unknown> & { paths: Record<string, Record<string, Record<string, unknown>>> }> {
  const response = await openApiRoute.GET(new Request("http://localhost:3000/api/openapi.json"), undefined as never);
  expect(response.status).toBe(200);
  return (await response.json()) as never;
}

describe("the OpenAPI document", () => {
  it("has an operation for every method every route file exports", async () => {
    const document = await servedDocument();
    const missing: string[] = [];
    for (const route of routes) {
      if (undocumented.has(route.path)) continue;
      expect(route.methods.length, `${route.file} exports no HTTP method`).toBeGreaterThan(0);
      for (const method of route.methods) if (!document.paths[route.path]?.[method.toLowerCase()]) missing.push(`${method} ${route.path} (${route.file})`);
    }
    expect(missing, "add these to lib/server/openapi/operations.ts").toEqual([]);
  });

  it("documents no operation that no route file answers", () => {
    const answered = new Set(routes.flatMap((route) => route.methods.map((method) => `${method.toLowerCase()} ${route.path}`)));
    const stale = apiOperations.map((operation) => `${operation.method} ${operation.path}`).filter((key) => !answered.has(key));
    expect(stale, "these operations have no route").toEqual([]);
  });

  it("is OpenAPI 3.1 whose $refs all resolve, with unique operation ids and path parameters that match the path", async () => {
    const document = await servedDocument();
    expect(document.openapi).toBe("3.1.0");
    const text = JSON.stringify(document);
    const refs = [...text.matchAll(/"\$ref":"([^"]+)"/g)].map((match) => match[1]!);
    expect(refs.length).toBeGreaterThan(0);
    for (const ref of refs) {
      expect(ref.startsWith("#/"), ref).toBe(true);
      let node: unknown = document;
      for (const part of ref.slice(2).split("/")) node = (node as Record<string, unknown> | undefined)?.[part.replace(/~1/g, "/").replace(/~0/g, "~")];
      expect(node, `unresolved ${ref}`).toBeTypeOf("object");
    }
    const ids = new Set<string>();
    for (const [path, item] of Object.entries(document.paths)) {
      const named = [...path.matchAll(/\{([^}]+)\}/g)].map((match) => match[1]).sort();
      for (const [method, operation] of Object.entries(item)) {
        const id = operation.operationId as string;
        expect(ids.has(id), `duplicate operationId ${id}`).toBe(false);
        ids.add(id);
        const parameters = (operation.parameters ?? []) as { in: string; name: string; required?: boolean }[];
        const inPath = parameters.filter((parameter) => parameter.in === "path");
        expect(inPath.map((parameter) => parameter.name).sort(), `${method} ${path}`).toEqual(named);
        for (const parameter of inPath) expect(parameter.required, `${method} ${path} ${parameter.name}`).toBe(true);
        const responses = operation.responses as Record<string, unknown>;
        expect(Object.keys(responses).length, `${method} ${path}`).toBeGreaterThan(0);
        if (operation["x-rarefact-access"] !== "public") {
          expect(responses["401"], `${method} ${path} needs its 401`).toBeDefined();
          expect((operation.security as unknown[]).length, `${method} ${path} needs a security scheme`).toBeGreaterThan(0);
        }
      }
    }
    const schemes = (document.components as { securitySchemes: Record<string, { type: string; scheme?: string }> }).securitySchemes;
    expect(schemes.bearerToken).toMatchObject({ type: "http", scheme: "bearer" });
    expect(schemes.sessionCookie).toMatchObject({ type: "apiKey", in: "cookie" });
  });

  it("describes bodies with the routes' own zod schemas", async () => {
    const document = await servedDocument();
    const createToken = document.paths["/api/me/tokens"]!.post as { requestBody: { content: Record<string, { schema: { properties: Record<string, unknown>; required: string[] } }> } };
    const schema = createToken.requestBody.content["application/json"]!.schema;
    expect(Object.keys(schema.properties).sort()).toEqual(["expiresInDays", "name", "role", "teamId"]);
    expect(schema.required.sort()).toEqual(["name", "role", "teamId"]);
    const csv = document.paths["/api/runs/{runId}/band-levels.csv"]!.get as { parameters: { name: string; schema: { enum?: string[] } }[] };
    expect(csv.parameters.find((parameter) => parameter.name === "bandsPerOctave")?.schema.enum).toEqual(["1", "3"]);
  });
});

describe("every API route goes through the access gate", () => {
  // better-auth's own routes, read-only links (their own gate: requireSharedStudy) and this document are open.
  const open = new Map([
    ["/api/auth/{all}", /auth\.handler\(/],
    ["/api/shared/{token}", /requireSharedStudy\(/],
    ["/api/shared/{token}/runs/{runId}/result", /requireSharedStudy\(/],
    ["/api/openapi.json", /buildOpenApiDocument\(/],
  ]);
  for (const route of routes) {
    it(`${route.path} asks who is calling`, () => {
      const gate = open.get(route.path) ?? /\b(requireCaller|requireSessionCaller|getCaller)\(request\.headers/;
      expect(route.source).toMatch(gate);
    });
  }
});

// Calls the app's route handlers in-process, as a browser would over HTTP, with cookies.
import * as authRoute from "@/app/api/auth/[...all]/route";

export const testOrigin = "http://localhost:3000";

type RouteHandler<Params> = (request: Request, context: { params: Promise<Params> }) => Promise<Response>;

export interface CallOptions<Params> {
  method?: string;
  path: string;
  params?: Params;
  body?: unknown;
  rawBody?: string;
  cookie?: string;
  /** An Authorization header, e.g. "Bearer rft_…" (a script's call). */
  authorization?: string;
}

export async function callRoute<Params>(handler: RouteHandler<Params>, options: CallOptions<Params>): Promise<Response> {
  const headers = new Headers({ origin: testOrigin });
  if (options.cookie) headers.set("cookie", options.cookie);
  if (options.authorization) headers.set("authorization", options.authorization);
  let body: string | undefined = options.rawBody;
  if (options.body !== undefined) {
    body = JSON.stringify(options.body);
    headers.set("content-type", "application/json");
  }
  const request = new Request(`${testOrigin}${options.path}`, { method: options.method ?? (body ? "POST" : "GET"), headers, body });
  return handler(request, { params: Promise.resolve((options.params ?? {}) as Params) });
}

async function callAuth(path: string, body: unknown, cookie?: string): Promise<Response> {
  const headers = new Headers({ origin: testOrigin, "content-type": "application/json" });
  if (cookie) headers.set("cookie", cookie);
  return authRoute.POST(new Request(`${testOrigin}/api/auth${path}`, { method: "POST", headers, body: JSON.stringify(body) }));
}

/** The cookie header a browser would send back after this response. */
export function cookieFrom(response: Response): string {
  return response.headers
    .getSetCookie()
    .map((line) => line.split(";")[0])
    .join("; ");
}

export async function signUp(input: { name: string; email: string; password: string }): Promise<Response> {
  return callAuth("/sign-up/email", input);
}

export async function signIn(input: { email: string; password: string }): Promise<Response> {
  return callAuth("/sign-in/email", input);
}

export async function signOut(cookie: string): Promise<Response> {
  return callAuth("/sign-out", {}, cookie);
}

export async function signInAs(email: string, password: string): Promise<string> {
  const response = await signIn({ email, password });
  if (response.status !== 200) throw new Error(`sign-in as ${email} failed: ${response.status} ${await response.text()}`);
  return cookieFrom(response);
}

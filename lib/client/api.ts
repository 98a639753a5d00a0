// Fetching the app's own API from the browser: JSON in, JSON out, and the server's error body
// (code, message, field issues) carried through so that forms can show it beside the field.
import { isErrorBody, type FieldIssue } from "@/lib/http/app-error";

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly issues: FieldIssue[];

  constructor(status: number, code: string, message: string, issues: FieldIssue[] = []) {
    super(message);
    this.name = "ApiError";
    this.status = status;
    this.code = code;
    this.issues = issues;
  }
}

export async function fetchJson<T>(url: string, init: RequestInit & { json?: unknown } = {}): Promise<T> {
  const { json, ...rest } = init;
  const headers = new Headers(rest.headers);
  if (json !== undefined) headers.set("content-type", "application/json");
  let response: Response;
  try {
    response = await fetch(url, { ...rest, headers, body: json !== undefined ? JSON.stringify(json) : rest.body, credentials: "same-origin" });
  } catch {
    throw new ApiError(0, "network", "The server could not be reached. Check your connection and try again.");
  }
  const body: unknown = await response.json().catch(() => null);
  if (!response.ok) {
    if (isErrorBody(body)) throw new ApiError(response.status, body.error.code, body.error.message, body.error.issues ?? []);
    throw new ApiError(response.status, "unknown", `The server answered ${response.status}.`);
  }
  return body as T;
}

// Route handler plumbing: parse input with zod into 400s that name the field, turn AppErrors
// into JSON answers, and never let a raw exception reach the client.
import "server-only";
import type { z } from "zod";
import { AppError, type FieldIssue } from "@/lib/http/app-error";

export function issuesFromZod(error: z.ZodError): FieldIssue[] {
  return error.issues.map((issue) => ({
    path: issue.path.map((segment) => (typeof segment === "number" ? `[${segment}]` : String(segment))).join(".").replace(/\.\[/g, "["),
    message: issue.message,
  }));
}

function badRequest(subject: string, issues: FieldIssue[]): AppError {
  const first = issues[0];
  const message = first ? (first.path ? `${first.path}: ${first.message}` : first.message) : "The request is not valid.";
  return new AppError(`bad_request:${subject}`, message, issues);
}

/** Maximum JSON body accepted by the general API routes (result uploads have their own limit). */
export const defaultBodyLimitBytes = 256 * 1024;

export async function parseJsonBody<Schema extends z.ZodType>(
  request: Request,
  schema: Schema,
  subject: string,
  limitBytes = defaultBodyLimitBytes,
): Promise<z.output<Schema>> {
  const declared = Number(request.headers.get("content-length") ?? "0");
  if (declared > limitBytes) throw new AppError(`payload_too_large:${subject}`, `The request body is larger than ${Math.round(limitBytes / 1024)} KiB.`);
  const text = await request.text();
  if (text.length > limitBytes) throw new AppError(`payload_too_large:${subject}`, `The request body is larger than ${Math.round(limitBytes / 1024)} KiB.`);
  let body: unknown;
  try {
    body = text.length ? JSON.parse(text) : undefined;
  } catch {
    throw new AppError(`bad_request:${subject}`, "The request body is not valid JSON.", [{ path: "", message: "not valid JSON" }]);
  }
  const result = schema.safeParse(body);
  if (!result.success) throw badRequest(subject, issuesFromZod(result.error));
  return result.data;
}

export function parseWith<Schema extends z.ZodType>(schema: Schema, value: unknown, subject: string): z.output<Schema> {
  const result = schema.safeParse(value);
  if (!result.success) throw badRequest(subject, issuesFromZod(result.error));
  return result.data;
}

export function errorResponse(error: unknown): Response {
  if (error instanceof AppError) return Response.json(error.toBody(), { status: error.status });
  console.error("[api] unexpected error:", error);
  const internal = new AppError("internal:server", "Something went wrong on the server. Try again; if it persists, tell your administrator.");
  return Response.json(internal.toBody(), { status: 500 });
}

type Handler<Context> = (request: Request, context: Context) => Promise<Response>;

/** Wraps a route handler so that every failure answers JSON with the right status. */
export function apiRoute<Context>(handler: Handler<Context>): Handler<Context> {
  return async (request, context) => {
    try {
      return await handler(request, context);
    } catch (error) {
      return errorResponse(error);
    }
  };
}

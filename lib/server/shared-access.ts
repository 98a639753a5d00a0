// The gate for read-only links: the secret in the URL is the only credential. A malformed, unknown or
// revoked secret all answer the same 404, and every answer tells caches and search engines to keep out.
import "server-only";
import { cache } from "react";
import { findSharedStudyByToken, type SharedStudyAccess } from "@/db/queries/share-links";
import { AppError } from "@/lib/http/app-error";
import { shareTokenSchema } from "@/lib/validation/share-link";
import { errorResponse } from "./route";

export const sharedLinkGoneMessage = "This read-only link does not work: it may be incomplete, or its owner has revoked it.";

async function lookupSharedStudy(token: string): Promise<SharedStudyAccess | null> {
  const parsed = shareTokenSchema.safeParse(token);
  return parsed.success ? findSharedStudyByToken({ token: parsed.data }) : null;
}

/** The study a link opens; throws not_found for anything but a working link. Looked up afresh every time. */
export async function requireSharedStudy(token: string): Promise<SharedStudyAccess> {
  const access = await lookupSharedStudy(token);
  if (!access) throw new AppError("not_found:shared_link", sharedLinkGoneMessage);
  return access;
}

/**
 * For pages: the study a link opens, or null. Cached per request, so the layout's banner and the page
 * look the link up once.
 */
export const findSharedStudyForPage = cache(lookupSharedStudy);

/** Headers on every answer of a shared route: never stored (a revoked link must stop at once), never indexed. */
export const sharedResponseHeaders = { "cache-control": "no-store", "x-robots-tag": "noindex" } as const;

type Handler<Context> = (request: Request, context: Context) => Promise<Response>;

/** apiRoute for the shared routes: the same JSON errors, with the shared headers on every answer. */
export function sharedRoute<Context>(handler: Handler<Context>): Handler<Context> {
  return async (request, context) => {
    let response: Response;
    try {
      response = await handler(request, context);
    } catch (error) {
      response = errorResponse(error);
    }
    for (const [name, value] of Object.entries(sharedResponseHeaders)) response.headers.set(name, value);
    return response;
  };
}

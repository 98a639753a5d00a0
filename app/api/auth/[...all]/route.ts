// better-auth's endpoints (sign-up, sign-in, sign-out, session, teams). The auth module is
// imported lazily so that `next build` does not open the database while collecting routes.
async function handle(request: Request): Promise<Response> {
  const { getAuth } = await import("@/lib/server/auth");
  const auth = await getAuth();
  return auth.handler(request);
}

export const GET = handle;
export const POST = handle;

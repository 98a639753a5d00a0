// The access gate for pages (server components): the same caller lookup as the API, with a
// redirect to sign-in instead of a 401.
import "server-only";
import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { getCaller, type Caller } from "./access";

export async function getPageCaller(): Promise<Caller | null> {
  return getCaller(await headers());
}

export async function requirePageCaller(returnTo: string): Promise<Caller> {
  const caller = await getPageCaller();
  if (!caller) redirect(`/sign-in?next=${encodeURIComponent(returnTo)}`);
  return caller;
}

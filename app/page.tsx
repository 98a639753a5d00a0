import { redirect } from "next/navigation";
import { getPageCaller } from "@/lib/server/page-session";

export const dynamic = "force-dynamic";

export default async function Home() {
  redirect((await getPageCaller()) ? "/dashboard" : "/sign-in");
}

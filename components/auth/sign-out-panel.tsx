"use client";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button, buttonClasses } from "@/components/ui/button";
import { ErrorState } from "@/components/ui/states";
import { authClient } from "@/lib/client/auth-client";

export function SignOutPanel({ name }: { name: string }) {
  const router = useRouter();
  const [pending, setPending] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);

  async function signOut() {
    setPending(true);
    setFailure(null);
    const { error } = await authClient.signOut();
    if (error) {
      setFailure(error.message ?? "The server did not answer.");
      setPending(false);
      return;
    }
    router.replace("/sign-in?signedOut=1");
    router.refresh();
  }

  return (
    <div className="flex flex-col gap-5">
      <p className="text-[15px] text-ink-soft">
        You are signed in as <strong className="text-ink">{name}</strong>. Unsaved edits in other tabs of this browser will stop saving.
      </p>
      {failure ? <ErrorState title="Could not sign out" message={failure} /> : null}
      <div className="flex gap-3">
        <Button onClick={signOut} disabled={pending}>
          {pending ? "Signing out…" : "Sign out"}
        </Button>
        <Link href="/dashboard" className={buttonClasses("secondary")}>
          Stay signed in
        </Link>
      </div>
    </div>
  );
}

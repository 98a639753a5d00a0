"use client";
// Settings, API tokens: make a token for a script (its secret shown once), see when each was last
// used, revoke one. Tokens are personal; the team's feed records when one is made or revoked.
import Link from "next/link";
import { useState } from "react";
import { Breadcrumb } from "@/components/ui/breadcrumb";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import { useApiTokens, useCreateApiToken, useRevokeApiToken } from "@/lib/client/api-token-queries";
import { useMe } from "@/lib/client/queries";
import type { ApiTokenItem } from "@/lib/http/api-token-types";
import { ApiTokenForm } from "./api-token-form";
import { ApiTokenList } from "./api-token-list";
import { NewTokenBox } from "./new-token-box";

export function ApiTokensPage() {
  const me = useMe();
  const tokens = useApiTokens();
  const create = useCreateApiToken();
  const revoke = useRevokeApiToken();
  const [fresh, setFresh] = useState<{ name: string; secret: string } | null>(null);
  const [revokeProblem, setRevokeProblem] = useState<string | null>(null);

  async function revokeToken(token: ApiTokenItem) {
    setRevokeProblem(null);
    try {
      await revoke.mutateAsync(token.id);
    } catch (error) {
      setRevokeProblem(error instanceof Error ? error.message : "The token was not revoked.");
    }
  }

  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-col gap-2">
        <Breadcrumb links={[{ href: "/dashboard", label: "Studies" }]} current="API tokens" />
        <p className="text-sm font-medium text-tide-600">Settings</p>
        <h1 className="text-[28px] font-semibold leading-tight text-ink">API tokens</h1>
        <p className="max-w-3xl text-sm leading-relaxed text-ink-soft">
          Scripts call Rarefact’s API with a personal token: create scenes, queue runs and sweeps, fetch band levels as CSV. Send it as{" "}
          <code className="font-mono text-[13px]">Authorization: Bearer rft_…</code>. Every endpoint is described in the{" "}
          <Link href="/api-docs" className="font-medium text-tide-700 underline underline-offset-2">
            API reference
          </Link>
          .
        </p>
      </div>

      <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <section aria-labelledby="tokens-heading" className="flex min-w-0 flex-col gap-4">
          <h2 id="tokens-heading" className="text-lg font-semibold text-ink">
            Your tokens
          </h2>
          {fresh ? <NewTokenBox name={fresh.name} secret={fresh.secret} onDone={() => setFresh(null)} /> : null}
          {revokeProblem ? <ErrorState title="Not revoked" message={revokeProblem} /> : null}
          {tokens.isPending ? (
            <LoadingRows label="Loading your tokens" />
          ) : tokens.isError ? (
            <ErrorState title="Your tokens could not be loaded" message={tokens.error.message} onRetry={() => void tokens.refetch()} />
          ) : (
            <ApiTokenList tokens={tokens.data.tokens} revokingId={revoke.isPending ? (revoke.variables ?? null) : null} onRevoke={(token) => void revokeToken(token)} />
          )}
        </section>
        {me.isPending ? (
          <LoadingRows label="Loading your teams" />
        ) : me.isError ? (
          <ErrorState title="Your teams could not be loaded" message={me.error.message} onRetry={() => void me.refetch()} />
        ) : (
          <ApiTokenForm
            memberships={me.data.memberships}
            activeTeamId={me.data.activeTeamId}
            onCreate={async (input) => {
              const made = await create.mutateAsync(input);
              setFresh({ name: made.token.name, secret: made.secret });
            }}
          />
        )}
      </div>
    </div>
  );
}

"use client";
// The owner's "Share read-only" box on the study page: make a link for someone outside the team, copy it
// once, and revoke it later. Other roles see nothing (the server refuses them too).
import { useState } from "react";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import { roleAllows, type TeamRole } from "@/lib/access/roles";
import { useCreateShareLink, useRevokeShareLink, useShareLinks } from "@/lib/client/share-link-queries";
import type { ShareLinkItem } from "@/lib/http/share-link-types";
import { NewLinkBox } from "./new-link-box";
import { ShareLinkForm } from "./share-link-form";
import { ShareLinkList } from "./share-link-list";

export function ShareLinksPanel({ studyId, role }: { studyId: string; role: TeamRole }) {
  const allowed = roleAllows(role, "study:share");
  const links = useShareLinks(studyId, allowed);
  const create = useCreateShareLink(studyId);
  const revoke = useRevokeShareLink(studyId);
  const [made, setMade] = useState<{ label: string; url: string } | null>(null);
  if (!allowed) return null;

  const askRevoke = (link: ShareLinkItem) => {
    if (!window.confirm(`Revoke the link for “${link.label}”? It stops working at once for whoever holds it; this cannot be undone.`)) return;
    revoke.mutate(link.id);
  };

  return (
    <section aria-labelledby="share-heading" className="flex flex-col gap-4" data-testid="share-links-panel">
      <h2 id="share-heading" className="text-lg font-semibold text-ink">
        Share read-only
      </h2>
      <div className="flex flex-col gap-4 rounded-lg border border-rule bg-panel p-4">
        <p className="text-[13px] leading-relaxed text-ink-soft">
          Anyone holding a link reads this study&apos;s notebook, scenes and saved runs without signing in, and changes nothing, until you revoke it.
        </p>
        {made ? (
          <NewLinkBox label={made.label} url={made.url} onDone={() => setMade(null)} />
        ) : (
          <ShareLinkForm
            onCreate={async (label) => {
              const answer = await create.mutateAsync({ label });
              setMade({ label: answer.link.label, url: answer.url });
            }}
          />
        )}
        {revoke.isError ? <ErrorState title="The link was not revoked" message={revoke.error.message} /> : null}
        {links.isPending ? (
          <LoadingRows rows={1} label="Loading the read-only links" />
        ) : links.isError ? (
          <ErrorState title="The read-only links could not be loaded" message={links.error.message} onRetry={() => void links.refetch()} />
        ) : (
          <ShareLinkList links={links.data.links} revokingId={revoke.isPending ? (revoke.variables ?? null) : null} onRevoke={askRevoke} />
        )}
      </div>
    </section>
  );
}

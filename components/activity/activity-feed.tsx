"use client";
// An activity feed: entries grouped by day, newest first, each a sentence with links, and older
// pages on request. The study page and the team page pass their own query.
import type { InfiniteData, UseInfiniteQueryResult } from "@tanstack/react-query";
import { useMemo } from "react";
import { Button } from "@/components/ui/button";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import { describeActivity, groupByDay } from "@/lib/collaboration/activity-sentences";
import { formatWhen } from "@/lib/client/format";
import type { FeedPage } from "@/lib/http/activity-types";
import { ActivitySentenceText } from "./activity-sentence";

const timeFormat = new Intl.DateTimeFormat("en-GB", { hour: "2-digit", minute: "2-digit" });

export function ActivityFeed({
  query,
  viewerId,
  withStudy = false,
  emptyText = "Nothing has happened here yet.",
}: {
  query: UseInfiniteQueryResult<InfiniteData<FeedPage>>;
  viewerId: string | null;
  /** The team feed names the study of each entry. */
  withStudy?: boolean;
  emptyText?: string;
}) {
  const items = useMemo(() => query.data?.pages.flatMap((page) => page.items) ?? [], [query.data]);
  const groups = useMemo(() => groupByDay(items), [items]);

  if (query.isPending) return <LoadingRows rows={2} label="Loading the activity" />;
  if (query.isError && items.length === 0) return <ErrorState title="The activity could not be loaded" message={query.error.message} onRetry={() => void query.refetch()} />;
  if (items.length === 0) return <p className="text-sm text-muted">{emptyText}</p>;

  return (
    <div className="flex flex-col gap-5" data-testid="activity-feed">
      {groups.map((group) => (
        <section key={group.day} aria-label={group.label} className="flex flex-col gap-2.5">
          <h3 className="text-xs font-semibold uppercase tracking-wide text-muted">{group.label}</h3>
          <ol className="flex flex-col gap-3">
            {group.items.map((item) => (
              <li key={item.id} className="flex gap-3 text-sm" data-action={item.action}>
                <span aria-hidden className={`mt-1.5 size-2 shrink-0 rounded-full ${dotTone(item.action)}`} />
                <div className="min-w-0">
                  <p className="break-words text-ink-soft">
                    <ActivitySentenceText sentence={describeActivity(item, { viewerId, withStudy })} />
                  </p>
                  <p className="text-xs text-muted">
                    <time dateTime={item.createdAt} title={new Date(item.createdAt).toLocaleString("en-GB")}>
                      {entryTime(item.createdAt)}
                    </time>
                  </p>
                </div>
              </li>
            ))}
          </ol>
        </section>
      ))}
      {query.hasNextPage ? (
        <Button size="sm" variant="secondary" className="self-start" disabled={query.isFetchingNextPage} onClick={() => void query.fetchNextPage()}>
          {query.isFetchingNextPage ? "Loading…" : "Show older"}
        </Button>
      ) : null}
      {query.isFetchNextPageError ? <p className="text-sm text-signal-error">Older entries could not be loaded: {query.error?.message}</p> : null}
    </div>
  );
}

/** Under its day's heading an entry needs only the time; the last day's read "12 min ago". */
function entryTime(iso: string): string {
  const ageMs = Date.now() - new Date(iso).getTime();
  return ageMs < 86_400_000 ? formatWhen(iso) : timeFormat.format(new Date(iso));
}

/** A colour per kind of entry, so a long feed can be scanned: reviews ember, comments tide, the rest quiet. */
function dotTone(action: string): string {
  if (action.startsWith("run.reviewed")) return "bg-ember-500";
  if (action.startsWith("comment.")) return "bg-tide-500";
  if (action.startsWith("run.") || action === "scene.forked") return "bg-tide-300";
  return "bg-rule-strong";
}

"use client";
// A time in the shared pages, which are rendered on the server: the date as stored until the page has
// hydrated, then relative to the reader's clock ("5 min ago") with the local time on hover. Rendering the
// relative time on the server would not match the browser's.
import { formatWhen } from "@/lib/client/format";
import { useHydrated } from "@/lib/client/use-hydrated";

export function SharedWhen({ iso }: { iso: string }) {
  const hydrated = useHydrated();
  return (
    <time dateTime={iso} title={hydrated ? new Date(iso).toLocaleString("en-GB") : undefined}>
      {hydrated ? formatWhen(iso) : iso.slice(0, 10)}
    </time>
  );
}

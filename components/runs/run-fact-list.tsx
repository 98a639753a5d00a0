// The facts under a saved run's title (who ran it, wall time, solver, hash…), for members and behind read-only links.
import type { ReactNode } from "react";

export function RunFactList({ facts }: { facts: [string, ReactNode][] }) {
  return (
    <dl className="mt-3 flex flex-wrap gap-x-6 gap-y-2 text-sm">
      {facts.map(([label, value]) => (
        <div key={label}>
          <dt className="text-xs text-muted">{label}</dt>
          <dd className="text-ink">{value}</dd>
        </div>
      ))}
    </dl>
  );
}

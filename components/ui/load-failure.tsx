// What a page shows when its main record cannot be loaded: a 404 means the record is gone or
// belongs to another team (the server does not say which), anything else may pass on a retry.
import Link from "next/link";
import { ErrorState } from "@/components/ui/states";
import { ApiError } from "@/lib/client/api";

export function LoadFailure({ subject, error, onRetry, back }: { subject: string; error: Error; onRetry?: () => void; back?: { href: string; label: string } }) {
  const notFound = error instanceof ApiError && error.status === 404;
  const state = (
    <ErrorState
      title={notFound ? `No such ${subject}` : `The ${subject} could not be loaded`}
      message={notFound ? "It may have been deleted, or it belongs to a team you are not on." : error.message}
      onRetry={notFound ? undefined : onRetry}
    />
  );
  if (!back) return state;
  return (
    <div className="flex flex-col gap-4">
      {state}
      <Link href={back.href} className="text-sm font-medium text-tide-600 hover:underline">
        {back.label}
      </Link>
    </div>
  );
}

// Whether a message left the machine: sent, kept (no mail server) or failed (with the reason elsewhere).
import type { KeptMailItem } from "@/lib/http/team-types";

const statuses: Record<KeptMailItem["status"], { label: string; tone: string }> = {
  sent: { label: "Sent", tone: "bg-paper text-signal-ok ring-rule-strong" },
  kept: { label: "Kept", tone: "bg-tide-50 text-tide-700 ring-tide-300/60" },
  failed: { label: "Failed", tone: "bg-signal-error-50 text-signal-error ring-signal-error/30" },
};

export const mailKindLabels: Record<KeptMailItem["kind"], string> = {
  invitation: "Invitation",
  mention: "Mention",
  review_request: "Review request",
  review_decision: "Review decision",
};

export function MailStatus({ status }: { status: KeptMailItem["status"] }) {
  return <span className={`inline-flex rounded-full px-2 py-0.5 text-xs font-medium ring-1 ${statuses[status].tone}`}>{statuses[status].label}</span>;
}

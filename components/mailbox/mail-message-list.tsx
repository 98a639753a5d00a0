"use client";
// The mailbox's list: newest first, one row per message, the selected one marked.
import { formatWhen } from "@/lib/client/format";
import type { KeptMailItem } from "@/lib/http/team-types";
import { MailStatus, mailKindLabels } from "./mail-status";

export function MailMessageList({ messages, selectedId, onSelect }: { messages: KeptMailItem[]; selectedId: string; onSelect: (id: string) => void }) {
  return (
    <ul aria-label="Kept e-mail" className="flex flex-col divide-y divide-rule self-start overflow-hidden rounded-lg border border-rule bg-panel">
      {messages.map((message) => {
        const selected = message.id === selectedId;
        return (
          <li key={message.id}>
            <button
              type="button"
              aria-current={selected ? "true" : undefined}
              onClick={() => onSelect(message.id)}
              className={`flex w-full flex-col gap-1 px-4 py-3 text-left transition-colors ${selected ? "bg-tide-50" : "hover:bg-paper"}`}
            >
              <span className="flex items-center justify-between gap-2 text-xs text-muted">
                <span>
                  {mailKindLabels[message.kind]} · {formatWhen(message.createdAt)}
                </span>
                <MailStatus status={message.status} />
              </span>
              <span className="truncate text-sm font-medium text-ink">{message.subject}</span>
              <span className="truncate text-xs text-ink-soft">To {message.toAddress}</span>
            </button>
          </li>
        );
      })}
    </ul>
  );
}

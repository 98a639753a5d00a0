"use client";
// One kept message as its recipient would read it: the plain text by default, the HTML copy in a
// sandboxed frame (no scripts, no same-origin access), and the reason when sending failed.
import { useState } from "react";
import type { KeptMailItem } from "@/lib/http/team-types";
import { MailStatus, mailKindLabels } from "./mail-status";

const dateFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" });

/** Web addresses in the text become links (to pass an invitation on, or open it in another browser). */
function LinkedText({ text }: { text: string }) {
  return text.split(/(https?:\/\/[^\s<>"]+)/g).map((part, index) =>
    index % 2 === 1 ? (
      <a key={index} href={part} rel="noreferrer noopener" target="_blank" className="break-all text-tide-600 underline underline-offset-2">
        {part}
      </a>
    ) : (
      part
    ),
  );
}

export function MailMessageView({ message }: { message: KeptMailItem }) {
  const [asHtml, setAsHtml] = useState(false);
  const showHtml = asHtml && message.htmlBody !== null;
  return (
    <article aria-label="Selected e-mail" className="flex min-w-0 flex-col gap-4 rounded-lg border border-rule bg-panel p-5">
      <header className="flex flex-col gap-2 border-b border-rule pb-4">
        <h2 className="text-lg font-semibold text-ink">{message.subject}</h2>
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
          <dt className="text-muted">To</dt>
          <dd className="text-ink-soft">{message.toAddress}</dd>
          <dt className="text-muted">Kind</dt>
          <dd className="text-ink-soft">{mailKindLabels[message.kind]}</dd>
          <dt className="text-muted">Written</dt>
          <dd className="text-ink-soft">{dateFormat.format(new Date(message.createdAt))}</dd>
          <dt className="text-muted">Status</dt>
          <dd className="flex items-center gap-2 text-ink-soft">
            <MailStatus status={message.status} />
            {message.sentAt ? <span>sent {dateFormat.format(new Date(message.sentAt))}</span> : null}
          </dd>
        </dl>
        {message.status === "failed" ? (
          <p role="note" className="rounded-md bg-signal-error-50 px-3 py-2 text-sm text-ink-soft">
            <span className="font-medium text-signal-error">Not sent: </span>
            {message.error || "the mail server gave no reason."} The message is kept here; what it was about still stands.
          </p>
        ) : null}
      </header>
      {message.htmlBody !== null ? (
        <div role="group" aria-label="Show as" className="flex gap-1 text-sm">
          {(["Text", "Formatted"] as const).map((label) => {
            const active = (label === "Formatted") === showHtml;
            return (
              <button
                key={label}
                type="button"
                aria-pressed={active}
                onClick={() => setAsHtml(label === "Formatted")}
                className={`rounded-md px-2.5 py-1 font-medium ${active ? "bg-tide-50 text-tide-700" : "text-muted hover:text-ink"}`}
              >
                {label}
              </button>
            );
          })}
        </div>
      ) : null}
      {showHtml ? (
        <iframe title={`Formatted copy of ${message.subject}`} sandbox="" srcDoc={message.htmlBody ?? ""} className="h-96 w-full rounded-md border border-rule bg-white" />
      ) : (
        <pre className="whitespace-pre-wrap break-words font-sans text-[15px] leading-relaxed text-ink">
          <LinkedText text={message.textBody} />
        </pre>
      )}
    </article>
  );
}

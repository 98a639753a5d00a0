"use client";
// A Markdown text area that offers the team's members when the user types "@": arrows move through
// the list, Enter or Tab inserts "@Full Name", Escape closes it. The composer turns those names into
// mention tokens when it posts.
import { useId, useMemo, useRef, useState, type KeyboardEvent } from "react";
import { matchMembers, mentionQueryAt, type MentionCandidate } from "@/lib/collaboration/mentions";

export interface MentionMember extends MentionCandidate {
  role?: string;
}

export function MentionTextarea({
  value,
  onChange,
  members,
  label,
  placeholder,
  invalid = false,
  autoFocus = false,
  onSubmitShortcut,
  describedBy,
}: {
  value: string;
  onChange: (value: string) => void;
  members: readonly MentionMember[];
  label: string;
  placeholder?: string;
  invalid?: boolean;
  autoFocus?: boolean;
  /** Ctrl/Cmd + Enter. */
  onSubmitShortcut?: () => void;
  describedBy?: string;
}) {
  const listId = useId();
  const area = useRef<HTMLTextAreaElement>(null);
  const [caret, setCaret] = useState<number | null>(null);
  const [active, setActive] = useState(0);
  const [dismissedAt, setDismissedAt] = useState<number | null>(null);

  const query = caret === null ? null : mentionQueryAt(value, caret);
  const matches = useMemo(() => (query ? matchMembers(members, query.query) : []), [members, query]);
  const open = query !== null && matches.length > 0 && dismissedAt !== query.start;
  const highlighted = Math.min(active, matches.length - 1);

  function insert(member: MentionMember) {
    if (!query || caret === null) return;
    const inserted = `@${member.name} `;
    const next = value.slice(0, query.start) + inserted + value.slice(caret);
    const position = query.start + inserted.length;
    onChange(next);
    setCaret(position);
    setActive(0);
    // Put the caret after the name once React has written the new value.
    requestAnimationFrame(() => {
      area.current?.focus();
      area.current?.setSelectionRange(position, position);
    });
  }

  function onKeyDown(event: KeyboardEvent<HTMLTextAreaElement>) {
    if (open) {
      if (event.key === "ArrowDown" || event.key === "ArrowUp") {
        event.preventDefault();
        setActive((index) => (index + (event.key === "ArrowDown" ? 1 : matches.length - 1)) % matches.length);
        return;
      }
      if (event.key === "Enter" || event.key === "Tab") {
        event.preventDefault();
        insert(matches[highlighted]!);
        return;
      }
      if (event.key === "Escape") {
        event.preventDefault();
        event.stopPropagation();
        setDismissedAt(query.start);
        return;
      }
    }
    if (event.key === "Enter" && (event.ctrlKey || event.metaKey) && onSubmitShortcut) {
      event.preventDefault();
      onSubmitShortcut();
    }
  }

  const track = () => setCaret(area.current?.selectionStart ?? null);

  return (
    <div className="relative">
      <textarea
        ref={area}
        aria-label={label}
        aria-autocomplete="list"
        aria-controls={open ? listId : undefined}
        aria-activedescendant={open ? `${listId}-${highlighted}` : undefined}
        aria-invalid={invalid || undefined}
        aria-describedby={describedBy}
        autoFocus={autoFocus}
        value={value}
        placeholder={placeholder}
        onChange={(event) => {
          onChange(event.target.value);
          setCaret(event.target.selectionStart);
          setActive(0);
        }}
        onKeyDown={onKeyDown}
        onKeyUp={(event) => {
          if (!["ArrowDown", "ArrowUp", "Enter", "Tab", "Escape"].includes(event.key)) track();
        }}
        onClick={track}
        onBlur={() => setCaret(null)}
        onFocus={track}
        rows={3}
        className={`block min-h-20 w-full resize-y rounded-md border bg-panel px-3 py-2 text-[14px] leading-relaxed text-ink placeholder:text-muted/70 focus:outline-none focus:ring-2 ${
          invalid ? "border-signal-error focus:ring-signal-error/25" : "border-rule-strong focus:border-tide-500 focus:ring-tide-500/20"
        }`}
      />
      {open ? (
        <ul id={listId} role="listbox" aria-label="Team members" className="absolute left-2 top-full z-20 mt-1 w-64 overflow-hidden rounded-md border border-rule-strong bg-panel py-1 text-sm shadow-lg">
          {matches.map((member, index) => (
            <li
              key={member.userId}
              id={`${listId}-${index}`}
              role="option"
              aria-selected={index === highlighted}
              // Mouse down, not click: the text area must not lose the caret first.
              onMouseDown={(event) => {
                event.preventDefault();
                insert(member);
              }}
              onMouseEnter={() => setActive(index)}
              className={`flex cursor-pointer items-center justify-between gap-2 px-3 py-1.5 ${index === highlighted ? "bg-tide-50 text-tide-700" : "text-ink"}`}
            >
              <span className="truncate font-medium">{member.name}</span>
              {member.role ? <span className="text-xs capitalize text-muted">{member.role}</span> : null}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

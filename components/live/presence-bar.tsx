"use client";
// Who else is in the study (on any of its pages: notebook, a scene, a run): small initials, names on
// hover, and one sentence for everyone. Worded for the study, since presence is kept per study.
import { useStudyPresence } from "@/lib/client/activity-queries";
import type { PresentUser } from "@/lib/http/activity-types";

export function presenceSentence(others: PresentUser[]): string {
  if (others.length === 0) return "Only you are in this study now";
  if (others.length === 1) return `You and ${others[0]!.name} are in this study now`;
  return `You and ${others.length} others are in this study now`;
}

export function PresenceBar({ studyId, viewerId }: { studyId: string; viewerId: string | null }) {
  const presence = useStudyPresence(studyId);
  // Before the first answer (or if it fails) say nothing rather than something wrong.
  if (!presence.data) return null;
  const others = presence.data.present.filter((person) => person.userId !== viewerId);
  const names = others.map((person) => person.name).join(", ");
  return (
    <div className="flex items-center gap-2" data-testid="presence-bar">
      {others.length > 0 ? (
        <ul aria-label="Colleagues in this study now" className="flex -space-x-1.5">
          {others.slice(0, 5).map((person) => (
            <li
              key={person.userId}
              title={`${person.name}, here since ${new Date(person.since).toLocaleTimeString("en-GB", { hour: "2-digit", minute: "2-digit" })}`}
              className="inline-flex size-7 items-center justify-center rounded-full bg-tide-600 text-[11px] font-semibold text-white ring-2 ring-panel"
            >
              <span aria-hidden>{person.initials}</span>
              <span className="sr-only">{person.name}</span>
            </li>
          ))}
          {others.length > 5 ? (
            <li className="inline-flex size-7 items-center justify-center rounded-full bg-paper text-[11px] font-semibold text-ink-soft ring-2 ring-panel">+{others.length - 5}</li>
          ) : null}
        </ul>
      ) : null}
      <p className="text-xs text-muted" title={names || undefined}>
        {presenceSentence(others)}
      </p>
    </div>
  );
}

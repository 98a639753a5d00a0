// One activity entry as a sentence, its things linked where they still exist.
import Link from "next/link";
import type { ActivitySentence } from "@/lib/collaboration/activity-sentences";

export function ActivitySentenceText({ sentence }: { sentence: ActivitySentence }) {
  return (
    <>
      <span className="font-medium text-ink">{sentence.actor}</span>{" "}
      {sentence.parts.map((part, index) =>
        part.href ? (
          <Link key={index} href={part.href} className="font-medium text-tide-700 hover:underline">
            {part.text}
          </Link>
        ) : (
          <span key={index}>{part.text}</span>
        ),
      )}
    </>
  );
}

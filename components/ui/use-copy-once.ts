"use client";
// Copying a secret that is shown once (a read-only link, an API token): the clipboard where the
// browser allows it; otherwise the field is focused and selected so that Ctrl+C copies it.
import { useRef, useState } from "react";

export type CopyState = "no" | "yes" | "select";

export function useCopyOnce(text: string) {
  const field = useRef<HTMLInputElement>(null);
  const [copied, setCopied] = useState<CopyState>("no");

  async function copy() {
    try {
      if (!navigator.clipboard) throw new Error("no clipboard");
      await navigator.clipboard.writeText(text);
      setCopied("yes");
    } catch {
      field.current?.focus();
      field.current?.select();
      setCopied("select");
    }
  }

  return { field, copied, copy };
}

"use client";
// A comment's Markdown, drawn without raw HTML: mention tokens become highlighted names, links open
// in a new tab, and only the usual URL schemes survive (react-markdown's own filter).
import { useMemo } from "react";
import ReactMarkdown, { defaultUrlTransform, type Components } from "react-markdown";
import remarkGfm from "remark-gfm";
import { mentionsAsLinks } from "@/lib/collaboration/mentions";

const MENTION_PREFIX = "mention:";

const components: Components = {
  a({ href, children }) {
    if (href?.startsWith(MENTION_PREFIX)) {
      return (
        <span className="rounded bg-tide-50 px-1 font-medium text-tide-700 ring-1 ring-tide-100" data-mention={href.slice(MENTION_PREFIX.length)}>
          {children}
        </span>
      );
    }
    return (
      <a href={href} target="_blank" rel="noopener noreferrer nofollow" className="text-tide-700 underline underline-offset-2">
        {children}
      </a>
    );
  },
  img({ alt }) {
    // Pages are cross-origin isolated and fetch nothing from outside: show what the image was.
    return <span className="text-muted">[image: {alt || "no description"}]</span>;
  },
};

function urlTransform(url: string): string {
  return url.startsWith(MENTION_PREFIX) ? url : defaultUrlTransform(url);
}

export function CommentBody({ body, names }: { body: string; names: ReadonlyMap<string, string> }) {
  const markdown = useMemo(() => mentionsAsLinks(body, names), [body, names]);
  return (
    <div className="notes-prose text-[14px] break-words">
      <ReactMarkdown remarkPlugins={[remarkGfm]} components={components} urlTransform={urlTransform} skipHtml>
        {markdown}
      </ReactMarkdown>
    </div>
  );
}

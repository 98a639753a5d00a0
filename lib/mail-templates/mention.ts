// The e-mail a member gets when a comment on a saved run names them: who wrote, on which run of
// which study, the comment itself (mentions as plain "@Name") and the link straight to it.
// Plain text first; the HTML copy says the same, with every value escaped.

export interface MentionMailInput {
  authorName: string;
  studyTitle: string;
  /** "Alder Row section, version 3". */
  runLabel: string;
  /** The comment as plain text (mention tokens already turned into "@Name"). */
  commentText: string;
  /** The run page with `#comment-<id>`. */
  link: string;
  reply: boolean;
}

export interface MentionMailContent {
  subject: string;
  text: string;
  html: string;
}

/** Longest stretch of the comment quoted in the e-mail; the rest is one click away. */
const MAX_QUOTED = 2000;

function escapeHtml(value: string): string {
  return value.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&#39;");
}

export function mentionMail({ authorName, studyTitle, runLabel, commentText, link, reply }: MentionMailInput): MentionMailContent {
  const quoted = commentText.length > MAX_QUOTED ? `${commentText.slice(0, MAX_QUOTED - 1)}…` : commentText;
  const where = `the saved run ${runLabel} in ${studyTitle}`;
  const subject = `${authorName} mentioned you on ${runLabel}`;
  const text = [
    `${authorName} mentioned you in a ${reply ? "reply" : "comment"} on ${where}:`,
    "",
    ...quoted.split("\n").map((line) => `> ${line}`),
    "",
    "Open the comment:",
    link,
    "",
    "You get this e-mail because a member of your team named you with @ in a comment.",
  ].join("\n");
  const html = [
    `<p>${escapeHtml(authorName)} mentioned you in a ${reply ? "reply" : "comment"} on ${escapeHtml(where)}:</p>`,
    `<blockquote style="margin:0 0 1em;padding-left:12px;border-left:3px solid #127673;white-space:pre-wrap">${escapeHtml(quoted)}</blockquote>`,
    `<p><a href="${escapeHtml(link)}">Open the comment</a></p>`,
    "<p>You get this e-mail because a member of your team named you with @ in a comment.</p>",
  ].join("\n");
  return { subject, text, html };
}

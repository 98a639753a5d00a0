// The e-mail reviewers and owners get when someone asks for a run to be reviewed: who asks, which
// run of which study (scene, version, run hash), their note, and the link to the run. Plain text
// first; the HTML copy says the same, with every value escaped.

export interface ReviewRequestMailInput {
  requesterName: string;
  studyTitle: string;
  /** "Design B, 4 m absorptive, version 3". */
  runLabel: string;
  runInputHash: string;
  note: string;
  /** The saved run's page. */
  link: string;
}

export interface ReviewMailContent {
  subject: string;
  text: string;
  html: string;
}

export function escapeHtml(value: string): string {
  return value.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&#39;");
}

/** The note as quoted lines for the text body. */
export function quoteLines(note: string): string[] {
  return note.split("\n").map((line) => `> ${line}`);
}

export function quoteHtml(note: string): string {
  return `<blockquote style="margin:0 0 1em;padding-left:12px;border-left:3px solid #127673;white-space:pre-wrap">${escapeHtml(note)}</blockquote>`;
}

export function reviewRequestMail({ requesterName, studyTitle, runLabel, runInputHash, note, link }: ReviewRequestMailInput): ReviewMailContent {
  const subject = `Review asked: ${runLabel} (${studyTitle})`;
  const hash = runInputHash.slice(0, 12);
  const text = [
    `${requesterName} asks for a review of the saved run ${runLabel} in ${studyTitle}.`,
    `Run hash: ${hash}`,
    ...(note ? ["", `${requesterName} writes:`, ...quoteLines(note)] : []),
    "",
    "Open the run to sign it off or ask for a revision:",
    link,
    "",
    "You get this e-mail because you review runs for your team on Rarefact.",
  ].join("\n");
  const html = [
    `<p>${escapeHtml(requesterName)} asks for a review of the saved run <strong>${escapeHtml(runLabel)}</strong> in ${escapeHtml(studyTitle)}.</p>`,
    `<p>Run hash: <code>${escapeHtml(hash)}</code></p>`,
    ...(note ? [`<p>${escapeHtml(requesterName)} writes:</p>`, quoteHtml(note)] : []),
    `<p><a href="${escapeHtml(link)}">Open the run</a> to sign it off or ask for a revision.</p>`,
    "<p>You get this e-mail because you review runs for your team on Rarefact.</p>",
  ].join("\n");
  return { subject, text, html };
}

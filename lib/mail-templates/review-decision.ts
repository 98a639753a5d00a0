// The e-mail the run's author (and whoever asked for the review) gets when a reviewer decides: a
// sign-off, a revision asked for, or a sign-off withdrawn, with the reviewer's note and the link.
import { escapeHtml, quoteHtml, quoteLines, type ReviewMailContent } from "./review-request";

export type ReviewDecisionKind = "signed_off" | "revision_asked" | "sign_off_withdrawn";

export interface ReviewDecisionMailInput {
  decision: ReviewDecisionKind;
  reviewerName: string;
  studyTitle: string;
  /** "Design B, 4 m absorptive, version 3". */
  runLabel: string;
  runInputHash: string;
  sceneVersion: number;
  note: string;
  link: string;
}

const verbs: Record<ReviewDecisionKind, { subject: string; sentence: string }> = {
  signed_off: { subject: "Signed off", sentence: "signed off" },
  revision_asked: { subject: "Revision asked", sentence: "asked for a revision of" },
  sign_off_withdrawn: { subject: "Sign-off withdrawn", sentence: "withdrew the sign-off of" },
};

export function reviewDecisionMail({ decision, reviewerName, studyTitle, runLabel, runInputHash, sceneVersion, note, link }: ReviewDecisionMailInput): ReviewMailContent {
  const verb = verbs[decision];
  const hash = runInputHash.slice(0, 12);
  const subject = `${verb.subject}: ${runLabel} (${studyTitle})`;
  const scope = decision === "signed_off" ? `The sign-off is for run hash ${hash}, made from version ${sceneVersion} of the scene.` : `Run hash: ${hash}.`;
  const text = [
    `${reviewerName} ${verb.sentence} the saved run ${runLabel} in ${studyTitle}.`,
    scope,
    ...(note ? ["", `${reviewerName} writes:`, ...quoteLines(note)] : []),
    "",
    "Open the run:",
    link,
    "",
    "You get this e-mail because you ran this simulation or asked for its review.",
  ].join("\n");
  const html = [
    `<p>${escapeHtml(reviewerName)} ${escapeHtml(verb.sentence)} the saved run <strong>${escapeHtml(runLabel)}</strong> in ${escapeHtml(studyTitle)}.</p>`,
    `<p>${escapeHtml(scope)}</p>`,
    ...(note ? [`<p>${escapeHtml(reviewerName)} writes:</p>`, quoteHtml(note)] : []),
    `<p><a href="${escapeHtml(link)}">Open the run</a></p>`,
    "<p>You get this e-mail because you ran this simulation or asked for its review.</p>",
  ].join("\n");
  return { subject, text, html };
}

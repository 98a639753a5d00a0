// The invitation e-mail: who invites whom to which team, in which role, until when, and the one
// link that lets them join. Plain text first; the HTML copy says the same, with every value escaped.
import { roleDescriptions, type TeamRole } from "@/lib/access/roles";

export interface InvitationMailInput {
  teamName: string;
  inviterName: string;
  role: TeamRole;
  link: string;
  expiresAt: Date;
}

export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

function escapeHtml(value: string): string {
  return value.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&#39;");
}

const expiryFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "long", year: "numeric", hour: "2-digit", minute: "2-digit", timeZone: "UTC", timeZoneName: "short" });

export function invitationMail({ teamName, inviterName, role, link, expiresAt }: InvitationMailInput): MailContent {
  const expiry = expiryFormat.format(expiresAt);
  const subject = `${inviterName} invites you to ${teamName} on Rarefact`;
  const text = [
    `${inviterName} invites you to join ${teamName} on Rarefact as ${role}.`,
    "",
    `As ${role}: ${roleDescriptions[role]}`,
    "",
    "To join, open this link and sign in (or create an account) with this e-mail address:",
    link,
    "",
    `The link works once and expires on ${expiry}.`,
    "If you did not expect this invitation, ignore this e-mail; nothing happens unless you open the link.",
  ].join("\n");
  const html = [
    `<p>${escapeHtml(inviterName)} invites you to join <strong>${escapeHtml(teamName)}</strong> on Rarefact as <strong>${escapeHtml(role)}</strong>.</p>`,
    `<p>As ${escapeHtml(role)}: ${escapeHtml(roleDescriptions[role])}</p>`,
    `<p>To join, open this link and sign in (or create an account) with this e-mail address:<br><a href="${escapeHtml(link)}">${escapeHtml(link)}</a></p>`,
    `<p>The link works once and expires on ${escapeHtml(expiry)}.</p>`,
    "<p>If you did not expect this invitation, ignore this e-mail; nothing happens unless you open the link.</p>",
  ].join("\n");
  return { subject, text, html };
}

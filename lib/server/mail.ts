// Sending e-mail. Every message is kept in the database first; with SMTP settings
// (RAREFACT_SMTP_URL) it is then sent through nodemailer, and with none the kept copy is the
// local stand-in that owners read in the app. Sending never throws: an e-mail that cannot go out
// must not undo the invitation, comment or decision that caused it.
import "server-only";
import nodemailer from "nodemailer";
import { insertMailMessage } from "@/db/queries/mail";
import type { MailKind } from "@/db/schema";

export interface OutgoingMail {
  teamId: string | null;
  kind: MailKind;
  to: { address: string; userId?: string | null; name?: string | null };
  subject: string;
  text: string;
  html?: string;
}

export interface MailOutcome {
  status: "kept" | "sent" | "failed";
  error?: string;
}

export function mailSender(): string {
  return process.env.RAREFACT_MAIL_FROM ?? "Rarefact <no-reply@rarefact.invalid>";
}

/** Whether messages leave the machine (SMTP configured) or are only kept for the in-app mailbox. */
export function mailMode(): "smtp" | "local" {
  return process.env.RAREFACT_SMTP_URL ? "smtp" : "local";
}

type Transport = ReturnType<typeof nodemailer.createTransport>;
const cacheKey = Symbol.for("rarefact.mail-transport");
type GlobalWithTransport = typeof globalThis & { [cacheKey]?: { url: string; transport: Transport } };

function smtpTransport(url: string): Transport {
  const store = globalThis as GlobalWithTransport;
  if (store[cacheKey]?.url !== url) store[cacheKey] = { url, transport: nodemailer.createTransport(url) };
  return store[cacheKey].transport;
}

export async function sendMail(mail: OutgoingMail): Promise<MailOutcome> {
  const url = process.env.RAREFACT_SMTP_URL;
  let outcome: MailOutcome = { status: "kept" };
  if (url) {
    try {
      await smtpTransport(url).sendMail({
        from: mailSender(),
        to: mail.to.name ? { name: mail.to.name, address: mail.to.address } : mail.to.address,
        subject: mail.subject,
        text: mail.text,
        ...(mail.html ? { html: mail.html } : {}),
      });
      outcome = { status: "sent" };
    } catch (error) {
      outcome = { status: "failed", error: error instanceof Error ? error.message : String(error) };
      console.error(`[mail] could not send "${mail.subject}" to ${mail.to.address}:`, outcome.error);
    }
  }
  try {
    await insertMailMessage({
      teamId: mail.teamId,
      kind: mail.kind,
      toAddress: mail.to.address,
      toUserId: mail.to.userId ?? null,
      subject: mail.subject,
      textBody: mail.text,
      htmlBody: mail.html ?? null,
      status: outcome.status,
      error: outcome.error ?? "",
      sentAt: outcome.status === "sent" ? new Date() : null,
    });
  } catch (error) {
    console.error("[mail] could not keep a copy of an e-mail:", error);
    return { status: "failed", error: "The e-mail could not be kept." };
  }
  return outcome;
}

/**
 * The address links in e-mails and shared links point at: RAREFACT_PUBLIC_URL (or BETTER_AUTH_URL)
 * when set, otherwise the origin the caller used. That origin is read from the Host header (and a
 * proxy's X-Forwarded-Proto/-Host), because the request's own URL may name the server's bind
 * address instead of the host the browser asked for. Set RAREFACT_PUBLIC_URL in production, so that
 * a forged Host header cannot change the links Rarefact writes into e-mail.
 */
export function publicAppUrl(path: string, request?: Request): string {
  const configured = process.env.RAREFACT_PUBLIC_URL ?? process.env.BETTER_AUTH_URL;
  return new URL(path, configured ?? (request ? requestOrigin(request) : `http://localhost:${process.env.PORT ?? "3000"}`)).toString();
}

function requestOrigin(request: Request): string {
  const url = new URL(request.url);
  const host = request.headers.get("x-forwarded-host")?.split(",")[0]?.trim() || request.headers.get("host") || url.host;
  const protocol = request.headers.get("x-forwarded-proto")?.split(",")[0]?.trim() || url.protocol.replace(":", "");
  return `${protocol}://${host}`;
}

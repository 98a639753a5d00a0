// The team's kept e-mail: every message Rarefact writes, whether or not SMTP sent it.
import "server-only";
import { and, desc, eq } from "drizzle-orm";
import type { MailKind, MailStatus } from "../schema";
import { getDb } from "../client";
import { mailMessage, type MailMessage } from "../schema";
import { newId, withDatabaseErrors } from "./wrap";

export interface MailRecordInput {
  teamId: string | null;
  kind: MailKind;
  toAddress: string;
  toUserId?: string | null;
  subject: string;
  textBody: string;
  htmlBody?: string | null;
  status: MailStatus;
  error?: string;
  sentAt?: Date | null;
}

export async function insertMailMessage(input: MailRecordInput): Promise<MailMessage> {
  return withDatabaseErrors("keep the e-mail", async () => {
    const db = await getDb();
    const [row] = await db
      .insert(mailMessage)
      .values({
        id: newId(),
        teamId: input.teamId,
        kind: input.kind,
        toAddress: input.toAddress,
        toUserId: input.toUserId ?? null,
        subject: input.subject,
        textBody: input.textBody,
        htmlBody: input.htmlBody ?? null,
        status: input.status,
        error: input.error ?? "",
        sentAt: input.sentAt ?? null,
      })
      .returning();
    return row!;
  });
}

export async function listMailMessagesByTeamId({ teamId, limit = 200 }: { teamId: string; limit?: number }): Promise<MailMessage[]> {
  return withDatabaseErrors("read the mailbox", async () => {
    const db = await getDb();
    return db.select().from(mailMessage).where(eq(mailMessage.teamId, teamId)).orderBy(desc(mailMessage.createdAt)).limit(limit);
  });
}

export async function getMailMessageById({ teamId, id }: { teamId: string; id: string }): Promise<MailMessage | null> {
  return withDatabaseErrors("read the e-mail", async () => {
    const db = await getDb();
    const [row] = await db.select().from(mailMessage).where(and(eq(mailMessage.teamId, teamId), eq(mailMessage.id, id)));
    return row ?? null;
  });
}

// The team's kept e-mail with its full content (owners only): without SMTP settings this is where
// invitations and notices can be read, so the whole flow works offline.
import { listMailMessagesByTeamId } from "@/db/queries/mail";
import type { TeamMailResponse } from "@/lib/http/team-types";
import { requireCaller, requireTeamAccess } from "@/lib/server/access";
import { mailMode } from "@/lib/server/mail";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

interface Context {
  params: Promise<{ teamId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const teamId = parseWith(idSchema, (await params).teamId, "team");
  const caller = await requireCaller(request.headers);
  await requireTeamAccess({ caller, teamId, action: "team:read-mail" });
  const messages = await listMailMessagesByTeamId({ teamId });
  const body: TeamMailResponse = {
    mode: mailMode(),
    messages: messages.map((message) => ({
      id: message.id,
      kind: message.kind,
      toAddress: message.toAddress,
      subject: message.subject,
      textBody: message.textBody,
      htmlBody: message.htmlBody,
      status: message.status,
      error: message.error,
      createdAt: message.createdAt.toISOString(),
      sentAt: message.sentAt?.toISOString() ?? null,
    })),
  };
  return Response.json(body);
});

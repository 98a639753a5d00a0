// 410 for an expired invitation: the link existed but its time is up (AppError has no 410 kind).
export function invitationGoneResponse(message: string): Response {
  return Response.json({ error: { code: "gone:invitation", message } }, { status: 410 });
}

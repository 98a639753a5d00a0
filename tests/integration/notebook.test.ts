import "../helpers/test-database";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as blockRoute from "@/app/api/blocks/[blockId]/route";
import * as meRoute from "@/app/api/me/route";
import * as orderRoute from "@/app/api/studies/[studyId]/blocks/order/route";
import * as blocksRoute from "@/app/api/studies/[studyId]/blocks/route";
import * as teamStudiesRoute from "@/app/api/teams/[teamId]/studies/route";
import { closeDb } from "@/db/client";
import { demoMembers, demoPassword } from "@/db/seed/demo-accounts";
import { prepareDatabase } from "@/db/startup";
import type { BlockItem } from "@/lib/http/api-types";
import { callRoute, signInAs } from "../helpers/api";

let owner = "";
let editor = "";
let viewer = "";
let studyId = "";

async function blocks(cookie: string): Promise<BlockItem[]> {
  const response = await callRoute(blocksRoute.GET, { path: `/api/studies/${studyId}/blocks`, params: { studyId }, cookie });
  return ((await response.json()) as { blocks: BlockItem[] }).blocks;
}

beforeAll(async () => {
  await prepareDatabase({ seed: true });
  owner = await signInAs(demoMembers.find((m) => m.role === "owner")!.email, demoPassword);
  editor = await signInAs(demoMembers.find((m) => m.role === "editor")!.email, demoPassword);
  viewer = await signInAs(demoMembers.find((m) => m.role === "viewer")!.email, demoPassword);
  const me = await callRoute(meRoute.GET, { path: "/api/me", cookie: owner });
  const teamId = ((await me.json()) as { activeTeamId: string }).activeTeamId;
  const list = await callRoute(teamStudiesRoute.GET, { path: `/api/teams/${teamId}/studies`, params: { teamId }, cookie: owner });
  studyId = ((await list.json()) as { studies: { id: string }[] }).studies[0]!.id;
});
afterAll(async () => {
  await closeDb();
});

describe("the study notebook", () => {
  it("opens the demo study as notes, its three scenes, then the plan", async () => {
    expect((await blocks(viewer)).map((b) => b.kind)).toEqual(["notes", "scene", "scene", "scene", "notes"]);
  });

  it("adds a notes block after a given block and keeps the order", async () => {
    const before = await blocks(editor);
    const response = await callRoute(blocksRoute.POST, {
      path: `/api/studies/${studyId}/blocks`,
      params: { studyId },
      cookie: editor,
      body: { kind: "notes", content: { markdown: "Between the brief and the first scene" }, afterBlockId: before[0]!.id },
    });
    expect(response.status).toBe(201);
    const after = await blocks(editor);
    expect((after[1]!.content as { markdown: string }).markdown).toBe("Between the brief and the first scene");
  });

  it("saves text on the latest version and answers 409 on a stale one", async () => {
    const [first] = await blocks(owner);
    const save = (cookie: string, baseVersion: number, markdown: string) =>
      callRoute(blockRoute.PATCH, { method: "PATCH", path: `/api/blocks/${first!.id}`, params: { blockId: first!.id }, cookie, body: { baseVersion, markdown } });
    expect((await save(owner, first!.version, "## The question (edited)")).status).toBe(200);
    const stale = await save(editor, first!.version, "An edit on the old text");
    expect(stale.status).toBe(409);
    expect(((await blocks(owner))[0]!.content as { markdown: string }).markdown).toBe("## The question (edited)");
  });

  it("moves blocks, and refuses an order that leaves one out", async () => {
    const current = await blocks(owner);
    const reversed = [...current].reverse().map((b) => b.id);
    const moved = await callRoute(orderRoute.PUT, { method: "PUT", path: `/api/studies/${studyId}/blocks/order`, params: { studyId }, cookie: owner, body: { blockIds: reversed } });
    expect(moved.status).toBe(200);
    expect((await blocks(owner)).map((b) => b.id)).toEqual(reversed);
    const partial = await callRoute(orderRoute.PUT, { method: "PUT", path: `/api/studies/${studyId}/blocks/order`, params: { studyId }, cookie: owner, body: { blockIds: reversed.slice(1) } });
    expect(partial.status).toBe(400);
  });

  it("lets a viewer read but not edit, add or delete", async () => {
    const [first] = await blocks(viewer);
    const edit = await callRoute(blockRoute.PATCH, { method: "PATCH", path: `/api/blocks/${first!.id}`, params: { blockId: first!.id }, cookie: viewer, body: { baseVersion: first!.version, collapsed: true } });
    expect(edit.status).toBe(403);
    const remove = await callRoute(blockRoute.DELETE, { method: "DELETE", path: `/api/blocks/${first!.id}`, params: { blockId: first!.id }, cookie: viewer });
    expect(remove.status).toBe(403);
  });

  it("deletes a notes block but not a scene's", async () => {
    const current = await blocks(owner);
    const notes = current.find((b) => b.kind === "notes")!;
    const scene = current.find((b) => b.kind === "scene")!;
    expect((await callRoute(blockRoute.DELETE, { method: "DELETE", path: `/api/blocks/${notes.id}`, params: { blockId: notes.id }, cookie: owner })).status).toBe(204);
    expect((await callRoute(blockRoute.DELETE, { method: "DELETE", path: `/api/blocks/${scene.id}`, params: { blockId: scene.id }, cookie: owner })).status).toBe(400);
  });
});

import { describe, expect, it } from "vitest";
import {
  commentExcerpt,
  findMentions,
  matchMembers,
  mentionQueryAt,
  mentionsAsLinks,
  mentionsAsPlainText,
  mentionToken,
  newlyMentioned,
  plainMentionsToTokens,
  splitOutsideCode,
} from "@/lib/collaboration/mentions";

const priya = { userId: "11111111-1111-4111-8111-111111111111", name: "Priya Raman" };
const tomas = { userId: "22222222-2222-4222-8222-222222222222", name: "Tomas Lindgren" };
const ana = { userId: "33333333-3333-4333-8333-333333333333", name: "Ana" };
const anaMaria = { userId: "44444444-4444-4444-8444-444444444444", name: "Ana Maria" };
const outsider = { userId: "55555555-5555-4555-8555-555555555555", name: "Outside Person" };
const members = [priya, tomas, ana, anaMaria];

describe("mention tokens", () => {
  it("writes a token that carries the member's id and a name without brackets", () => {
    expect(mentionToken(priya)).toBe(`@[Priya Raman](user:${priya.userId})`);
    expect(mentionToken({ userId: priya.userId, name: "Priya [QA] Raman" })).toBe(`@[Priya QA Raman](user:${priya.userId})`);
  });

  it("finds members named by token, each once, in order of first mention", () => {
    const body = `${mentionToken(tomas)} and ${mentionToken(priya)}: please check. Thanks ${mentionToken(tomas)}`;
    expect(findMentions(body, members)).toEqual([tomas.userId, priya.userId]);
  });

  it("ignores a token whose id is not a member of the team", () => {
    expect(findMentions(`${mentionToken(outsider)} ${mentionToken(priya)}`, members)).toEqual([priya.userId]);
  });

  it("reads the member by id, whatever name the token shows", () => {
    expect(findMentions(`@[Someone Else](user:${tomas.userId})`, members)).toEqual([tomas.userId]);
  });

  it("counts a plain @Name only when it is a member's whole name", () => {
    expect(findMentions("@priya raman, can you look at the 500 Hz band?", members)).toEqual([priya.userId]);
    expect(findMentions("@Priya please look", members)).toEqual([]);
    expect(findMentions("@Priya Ramanathan please look", members)).toEqual([]);
    expect(findMentions("mail me at tomas@Tomas Lindgren", members)).toEqual([]);
  });

  it("prefers the longest matching name", () => {
    expect(findMentions("@Ana Maria has the figures", members)).toEqual([anaMaria.userId]);
    expect(findMentions("@Ana has the figures", members)).toEqual([ana.userId]);
  });

  it("does not read mentions inside code spans or fenced code", () => {
    const body = ["See `@Priya Raman` and", "```", mentionToken(tomas), "```", `but ${mentionToken(ana)}`].join("\n");
    expect(findMentions(body, members)).toEqual([ana.userId]);
  });
});

describe("who hears of a mention", () => {
  it("e-mails only members newly named, never the author", () => {
    expect(newlyMentioned({ previous: [], next: [priya.userId, tomas.userId], authorId: tomas.userId })).toEqual([priya.userId]);
    expect(newlyMentioned({ previous: [priya.userId], next: [priya.userId, ana.userId], authorId: tomas.userId })).toEqual([ana.userId]);
    expect(newlyMentioned({ previous: [priya.userId], next: [], authorId: null })).toEqual([]);
  });
});

describe("showing a body", () => {
  it("splits code from text and gives the text back whole", () => {
    const body = "a `b` c\n```js\nx\n```\nd";
    const segments = splitOutsideCode(body);
    expect(segments.map((s) => s.text).join("")).toBe(body);
    expect(segments.filter((s) => s.code).map((s) => s.text)).toEqual(["`b`", "```js\nx\n```"]);
  });

  it("turns tokens into mention links for the renderer, with the member's current name", () => {
    const names = new Map([[priya.userId, "Priya Raman-Holt"]]);
    expect(mentionsAsLinks(`Hi ${mentionToken(priya)} and ${mentionToken(tomas)}`, names)).toBe(`Hi [@Priya Raman-Holt](mention:${priya.userId}) and [@Tomas Lindgren](mention:${tomas.userId})`);
  });

  it("turns tokens into plain @Name for excerpts and e-mails", () => {
    expect(mentionsAsPlainText(`Hi ${mentionToken(priya)}`)).toBe("Hi @Priya Raman");
    expect(commentExcerpt(`${mentionToken(priya)}\n\n${"x".repeat(200)}`, 30)).toBe(`@Priya Raman ${"x".repeat(16)}…`);
  });
});

describe("the composer's list of members", () => {
  it("writes tokens for the plain @Names the composer shows, leaving code and existing tokens alone", () => {
    const text = `@Ana Maria and @ana, ask @Priya Raman (not \`@Tomas Lindgren\`) ${mentionToken(tomas)} @Nobody`;
    expect(plainMentionsToTokens(text, members)).toBe(`${mentionToken(anaMaria)} and ${mentionToken(ana)}, ask ${mentionToken(priya)} (not \`@Tomas Lindgren\`) ${mentionToken(tomas)} @Nobody`);
    expect(findMentions(plainMentionsToTokens(text, members), members)).toEqual([anaMaria.userId, ana.userId, priya.userId, tomas.userId]);
  });

  it("finds the mention being typed at the caret", () => {
    expect(mentionQueryAt("Thanks @Pri", 11)).toEqual({ start: 7, query: "Pri" });
    expect(mentionQueryAt("@", 1)).toEqual({ start: 0, query: "" });
    expect(mentionQueryAt("mail tomas@fernhill", 19)).toBeNull();
    expect(mentionQueryAt("@Priya\nnext line", 16)).toBeNull();
  });

  it("lists names starting with the query first, then names with a word starting with it", () => {
    expect(matchMembers(members, "ra").map((m) => m.name)).toEqual(["Priya Raman"]);
    expect(matchMembers(members, "an").map((m) => m.name)).toEqual(["Ana", "Ana Maria"]);
    expect(matchMembers(members, "").length).toBe(4);
  });
});

// Mentions of team members in a comment's Markdown. The composer inserts a token that carries the
// member's id, `@[Priya Raman](user:<id>)`, so a mention survives a change of name and two members
// with one name stay apart; a plain "@Priya Raman" typed by hand also counts when it is exactly a
// member's name. Text inside code (fenced blocks and `spans`) is quoted, never a mention.

export interface MentionCandidate {
  userId: string;
  name: string;
}

/** `@[name](user:uuid)`: the name may not hold brackets or line breaks. */
const MENTION_TOKEN = /@\[([^\[\]\n]{1,200})\]\(user:([0-9a-fA-F-]{36})\)/g;

/** Fenced code blocks (``` or ~~~, to the closing fence or the end) and inline code spans. */
const CODE = /(^|\n)(```|~~~)[^\n]*\n[\s\S]*?(?:\n\2[^\n]*(?=\n|$)|$)|(`+)[^`]*?\3/g;

export interface TextSegment {
  text: string;
  code: boolean;
}

/** Splits Markdown into code and non-code stretches, in order; joined they give the text back. */
export function splitOutsideCode(markdown: string): TextSegment[] {
  const segments: TextSegment[] = [];
  let last = 0;
  for (const match of markdown.matchAll(CODE)) {
    // A fence match may begin with the line break before it: that break is ordinary text.
    const start = match.index + (match[1]?.length ?? 0);
    const end = match.index + match[0].length;
    if (start > last) segments.push({ text: markdown.slice(last, start), code: false });
    segments.push({ text: markdown.slice(start, end), code: true });
    last = end;
  }
  if (last < markdown.length) segments.push({ text: markdown.slice(last), code: false });
  return segments;
}

/** Removes what a mention token cannot hold, so any member's name makes a valid token. */
export function mentionTokenName(name: string): string {
  return name.replace(/[\[\]\n\r]+/g, " ").replace(/\s+/g, " ").trim().slice(0, 200) || "member";
}

/** The token the composer inserts for a member. */
export function mentionToken(member: MentionCandidate): string {
  return `@[${mentionTokenName(member.name)}](user:${member.userId})`;
}

function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
}

/**
 * The members a body mentions, each once, in order of first mention: tokens whose id is a member
 * (a token naming someone outside the team is ignored) and plain "@Name" matching a member's whole
 * name, case-insensitive.
 */
export function findMentions(markdown: string, members: readonly MentionCandidate[]): string[] {
  const byId = new Map(members.map((member) => [member.userId.toLowerCase(), member]));
  const found: { index: number; userId: string }[] = [];
  const byName = [...members].filter((member) => member.name.trim().length > 0).sort((a, b) => b.name.length - a.name.length);
  let offset = 0;
  for (const segment of splitOutsideCode(markdown)) {
    if (!segment.code) {
      // Tokens first; blank them out so their names are not read again as plain mentions.
      let blanked = segment.text.replace(MENTION_TOKEN, (whole, _name: string, id: string, index: number) => {
        const member = byId.get(id.toLowerCase());
        if (member) found.push({ index: offset + index, userId: member.userId });
        return " ".repeat(whole.length);
      });
      // Longest names first, each match blanked, so "@Ana Maria" is not read again as "@Ana".
      for (const member of byName) {
        const plain = new RegExp(`(^|[^\\p{L}\\p{N}_@])(@${escapeRegExp(member.name.trim())})(?![\\p{L}\\p{N}_-])`, "giu");
        blanked = blanked.replace(plain, (_whole, before: string, mention: string, index: number) => {
          found.push({ index: offset + index + before.length, userId: member.userId });
          return before + " ".repeat(mention.length);
        });
      }
    }
    offset += segment.text.length;
  }
  found.sort((a, b) => a.index - b.index);
  return [...new Set(found.map((item) => item.userId))];
}

/** Who should hear of a mention now: named in `next`, not in `previous`, and not the author. */
export function newlyMentioned({ previous, next, authorId }: { previous: readonly string[]; next: readonly string[]; authorId: string | null }): string[] {
  const before = new Set(previous);
  return next.filter((userId) => !before.has(userId) && userId !== authorId);
}

/**
 * The body as plain text for an excerpt or an e-mail: tokens become "@Name" (the member's current
 * name when known), code is left alone.
 */
export function mentionsAsPlainText(markdown: string, names: ReadonlyMap<string, string> = new Map()): string {
  return splitOutsideCode(markdown)
    .map((segment) => (segment.code ? segment.text : segment.text.replace(MENTION_TOKEN, (_whole, name: string, id: string) => `@${names.get(id) ?? name}`)))
    .join("");
}

/**
 * The body prepared for the Markdown renderer: each token becomes a link `[@Name](mention:<id>)` that
 * the renderer draws as a highlighted name. Code is left alone.
 */
export function mentionsAsLinks(markdown: string, names: ReadonlyMap<string, string> = new Map()): string {
  return splitOutsideCode(markdown)
    .map((segment) => (segment.code ? segment.text : segment.text.replace(MENTION_TOKEN, (_whole, name: string, id: string) => `[@${mentionTokenName(names.get(id) ?? name)}](mention:${id})`)))
    .join("");
}

/**
 * The composer shows mentions as "@Priya Raman" and writes tokens only when posting: each plain
 * "@Name" that is exactly a member's name (longest names first) becomes that member's token.
 * Existing tokens and code are left alone.
 */
export function plainMentionsToTokens(markdown: string, members: readonly MentionCandidate[]): string {
  const byName = [...members].filter((member) => member.name.trim().length > 0).sort((a, b) => b.name.length - a.name.length);
  return splitOutsideCode(markdown)
    .map((segment) => {
      if (segment.code) return segment.text;
      // Set tokens aside so the names inside them are not read again.
      const kept: string[] = [];
      let text = segment.text.replace(MENTION_TOKEN, (whole) => `\u0000${kept.push(whole) - 1}\u0000`);
      for (const member of byName) {
        const plain = new RegExp(`(^|[^\\p{L}\\p{N}_@])@${escapeRegExp(member.name.trim())}(?![\\p{L}\\p{N}_-])`, "giu");
        text = text.replace(plain, (_whole, before: string) => `${before}\u0000${kept.push(mentionToken(member)) - 1}\u0000`);
      }
      return text.replace(/\u0000(\d+)\u0000/g, (_whole, index: string) => kept[Number(index)]!);
    })
    .join("");
}

/** A short single-line excerpt of a comment (activity feeds, e-mail subjects). */
export function commentExcerpt(markdown: string, length = 120): string {
  const plain = mentionsAsPlainText(markdown).replace(/\s+/g, " ").trim();
  return plain.length <= length ? plain : `${plain.slice(0, length - 1)}…`;
}

/**
 * The mention being typed at the caret, for the composer's list: "@" at the start or after a space,
 * then up to 40 characters without a line break or another "@". Null when the caret is not in one.
 */
export function mentionQueryAt(text: string, caret: number): { start: number; query: string } | null {
  const before = text.slice(0, caret);
  const at = before.lastIndexOf("@");
  if (at < 0) return null;
  if (at > 0 && !/\s|[(\[]/.test(before[at - 1]!)) return null;
  const query = before.slice(at + 1);
  if (query.length > 40 || /[\n@\[\]]/.test(query)) return null;
  return { start: at, query };
}

/** Members whose name matches the typed query: names starting with it first, then any word starting with it. */
export function matchMembers<Member extends MentionCandidate>(members: readonly Member[], query: string, limit = 6): Member[] {
  const q = query.trim().toLowerCase();
  if (!q) return members.slice(0, limit);
  const starts = members.filter((member) => member.name.toLowerCase().startsWith(q));
  const words = members.filter((member) => !starts.includes(member) && member.name.toLowerCase().split(/\s+/).some((word) => word.startsWith(q)));
  return [...starts, ...words].slice(0, limit);
}

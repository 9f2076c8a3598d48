import type { Member } from '@/shared/teams';

/** The `@word` being typed at the end of the text, if any ("@Tob" → "Tob"). */
export function mentionQuery(text: string): string | null {
  const match = /(?:^|\s)@([^\s@]{0,40})$/u.exec(text);
  return match ? (match[1] ?? '') : null;
}

/** Members whose name has a word starting with the query, at most six. */
export function mentionMatches(members: readonly Member[], query: string, userId: string): Member[] {
  const q = query.toLocaleLowerCase();
  return members
    .filter((m) => m.userId !== userId)
    .filter((m) => q === '' || m.displayName.toLocaleLowerCase().split(/\s+/).some((word) => word.startsWith(q)))
    .slice(0, 6);
}

/** The ids of chosen people whose `@Name` is still in the text (a deleted mention does not notify). */
export function keptMentions(text: string, chosen: ReadonlyMap<string, string>): string[] {
  return [...chosen].filter(([, name]) => text.includes(`@${name}`)).map(([id]) => id);
}

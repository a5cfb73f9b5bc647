// A company's own names for Keelson's ranks: what it sends (only the ranks it renames) and the
// words every page, the planner's reasons and the print sheet write a rank with. Plain values,
// used on both sides.
import { z } from "zod";
import { RANKS, type Rank } from "./ranks";

/** Keelson's own words for its ranks. */
export const RANK_LABEL: Record<Rank, string> = {
  "chief-engineer": "Chief engineer",
  "second-engineer": "Second engineer",
  "third-engineer": "Third engineer",
  "fourth-engineer": "Fourth engineer",
  "electro-technical-officer": "Electro-technical officer",
  motorman: "Motorman",
  oiler: "Oiler",
};

export type RankNames = Partial<Record<Rank, string>>;

const RankName = (rank: Rank) =>
  z
    .string({ message: `The name for ${RANK_LABEL[rank].toLowerCase()} must be text.` })
    .trim()
    .max(40, { message: `Keep the name for ${RANK_LABEL[rank].toLowerCase()} to 40 characters or fewer.` })
    .regex(/^[^\p{Cc}]*$/u, {
      message: `The name for ${RANK_LABEL[rank].toLowerCase()} may not hold control characters.`,
    })
    .optional();

/** The renamed ranks; an empty name gives the rank back Keelson's word. Two ranks may not share a name. */
export const RankNamesInput = z
  .strictObject(Object.fromEntries(RANKS.map((r) => [r, RankName(r)])) as Record<Rank, ReturnType<typeof RankName>>, {
    error: (issue) =>
      issue.code === "unrecognized_keys"
        ? `${issue.keys.join(", ")} ${issue.keys.length === 1 ? "is not one of Keelson’s ranks" : "are not Keelson’s ranks"}: name only ${RANKS.join(", ")}.`
        : 'Send the rank names as an object, e.g. { "oiler": "Wiper" }.',
  })
  .transform((names, ctx) => {
    const kept: RankNames = {};
    for (const rank of RANKS) {
      const name = names[rank];
      if (name && name !== RANK_LABEL[rank]) kept[rank] = name;
    }
    const seen = new Map<string, Rank>();
    for (const rank of RANKS) {
      const word = (kept[rank] ?? RANK_LABEL[rank]).toLowerCase();
      const other = seen.get(word);
      if (other) {
        // The field to correct is the one renamed: a rank under Keelson's word was not typed.
        const [typed, taken] = kept[rank] ? [rank, other] : [other, rank];
        ctx.addIssue({
          code: "custom",
          path: [typed],
          message: `“${kept[typed]}” is already the name of ${RANK_LABEL[taken].toLowerCase()}: give each rank its own name.`,
        });
      }
      seen.set(word, rank);
    }
    return kept;
  });

/** How a company writes its ranks: Keelson's words where it has not renamed one. */
export type RankWords = {
  /** "Second engineer" (or the company's name for it); an unknown rank as sent. */
  label: (rank: string) => string;
  /** "Second engineer, motorman ×2". */
  team: (team: readonly { rank: string; count: number }[]) => string;
};

export function rankWords(names: RankNames = {}): RankWords {
  const label = (rank: string) => names[rank as Rank] ?? RANK_LABEL[rank as Rank] ?? rank;
  return {
    label,
    team: (team) =>
      team
        .map(({ rank, count }, i) => {
          const word = i === 0 ? label(rank) : lowerFirst(label(rank));
          return count > 1 ? `${word} ×${count}` : word;
        })
        .join(", "),
  };
}

/** "Motorman" → "motorman" inside a sentence; a name in capitals ("ETO") is left as written. */
export function lowerFirst(word: string): string {
  return /^\p{Lu}\p{Ll}/u.test(word) ? word.charAt(0).toLowerCase() + word.slice(1) : word;
}

/** The names as the settings form shows them: every rank, renamed or not. */
export type RankNamesView = { ranks: { rank: Rank; keelson: string; name: string | null }[] };

// The ranks in words, as every page shows them (routines, Backlog filters, port-stay crew).
import type { Rank } from "@/server/routines/contract";

export const RANK_LABEL: Record<Rank, string> = {
  "chief-engineer": "Chief engineer",
  "second-engineer": "Second engineer",
  "third-engineer": "Third engineer",
  "fourth-engineer": "Fourth engineer",
  "electro-technical-officer": "Electro-technical officer",
  motorman: "Motorman",
  oiler: "Oiler",
};

export const rankLabel = (rank: string) => RANK_LABEL[rank as Rank] ?? rank;

/** "Second engineer, motorman ×2": a team as pages write it. */
export function teamLabel(team: readonly { rank: string; count: number }[]): string {
  return team
    .map(({ rank, count }, i) => {
      const label = i === 0 ? rankLabel(rank) : rankLabel(rank).toLowerCase();
      return count > 1 ? `${label} ×${count}` : label;
    })
    .join(", ");
}

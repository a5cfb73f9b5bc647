// The ranks in words as Keelson writes them where no company's names apply (tests, the print of
// a plain team). Pages inside the app take the company's words from `useRankWords()`.
import { RANK_LABEL, rankWords } from "@/server/routines/rank-names";

export { RANK_LABEL };

const plain = rankWords();
export const rankLabel = plain.label;
/** "Second engineer, motorman ×2": a team as pages write it. */
export const teamLabel = plain.team;

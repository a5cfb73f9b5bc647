"use client";
// The company's names for its ranks, given once by the app's layout to every page below it.
import { createContext, useContext, useMemo } from "react";
import { type RankNames, type RankWords, rankWords } from "@/server/routines/rank-names";

const RankWordsContext = createContext<RankWords>(rankWords());

export function RankWordsProvider({ names, children }: { names: RankNames; children: React.ReactNode }) {
  const words = useMemo(() => rankWords(names), [names]);
  return <RankWordsContext.Provider value={words}>{children}</RankWordsContext.Provider>;
}

export const useRankWords = () => useContext(RankWordsContext);

/** A rank in the company's words, for table cells and lists. */
export function RankName({ rank }: { rank: string }) {
  return <>{useRankWords().label(rank)}</>;
}

/** A team in the company's words: "Second engineer, motorman ×2". */
export function TeamName({ team }: { team: readonly { rank: string; count: number }[] }) {
  return <>{useRankWords().team(team)}</>;
}

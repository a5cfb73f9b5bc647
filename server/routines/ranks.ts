// The ranks of an engine department that Keelson plans with: a routine's team, a stay's crew, who
// did a job. Plain values, imported by contracts on both sides (and kept out of them to avoid cycles).
export const RANKS = [
  "chief-engineer",
  "second-engineer",
  "third-engineer",
  "fourth-engineer",
  "electro-technical-officer",
  "motorman",
  "oiler",
] as const;
export type Rank = (typeof RANKS)[number];

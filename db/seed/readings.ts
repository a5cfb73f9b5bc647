// Plausible running hours for the demo: a voyage pattern of sea passages and port stays, and each
// machine's duty in it. Seeded, so a vessel always gets the same year of readings.
import type { DemoCounter } from "./scenario";

export { seededRandom } from "../../server/seeded-random";

/** Fraction of each day spent at sea: passages of 4–13 days, port stays of 1–3 days. */
export function voyagePattern(days: number, random: () => number): number[] {
  const pattern: number[] = [];
  while (pattern.length < days) {
    const passage = 4 + Math.floor(random() * 10);
    pattern.push(0.4, ...Array<number>(passage - 1).fill(1));
    const port = 1 + Math.floor(random() * 3);
    pattern.push(...Array<number>(port - 1).fill(0), 0.35);
  }
  return pattern.slice(0, days);
}

const tenth = (x: number) => Math.round(Math.min(24, Math.max(0, x)) * 10) / 10;

/** Hours a counter's machine ran on day `day` (0 = a year ago) given the fraction at sea. */
export function dailyHours(
  counter: DemoCounter,
  generatorIndex: number,
  generators: number,
  day: number,
  atSea: number,
  random: () => number,
): number {
  const jitter = (spread: number) => (random() - 0.5) * spread;
  switch (counter.duty) {
    case "main":
      return tenth(atSea * (22.5 + jitter(3)));
    case "generator": {
      // One set carries the sea load, rotating every ten days; in port a second one joins.
      const lead = Math.floor(day / 10) % generators;
      const second = (lead + 1) % generators;
      if (generatorIndex === lead) return tenth(23 + jitter(2));
      if (generatorIndex === second) return tenth((1 - atSea) * (20 + jitter(4)) + atSea * (random() < 0.1 ? 3 : 0));
      return tenth(random() < 0.05 ? 1.5 : 0);
    }
    case "emergency":
      return day % 7 === 3 ? tenth(0.5 + jitter(0.2)) : 0;
    case "compressor":
      return tenth((1 - atSea) * 5 + 1.2 + jitter(1));
    case "purifier":
      return tenth(atSea * 23 + (1 - atSea) * 8 + jitter(1.5));
    case "continuous":
      return tenth(23.3 + jitter(1.2));
    case "boiler":
      return tenth((1 - atSea) * 14 + atSea * 1.5 + jitter(1));
    case "steering":
      // Two pumps alternate weekly; this one carries the even weeks.
      return Math.floor(day / 7) % 2 === 0 ? tenth(atSea * 24) : tenth(atSea * 2);
    case "weekly-test":
      // SOLAS III/20.6: lifeboat engines run weekly for not less than 3 minutes.
      return day % 7 === 2 ? 0.1 : 0;
    case "monthly-test":
      // MSC.1/Circ.1432: fire pumps operated monthly.
      return day % 30 === 5 ? tenth(0.3 + jitter(0.2)) : 0;
  }
}

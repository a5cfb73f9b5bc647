// How the register says which counter a component runs on.
import type { RegisterComponent, RegisterCounter } from "@/server/register/contract";
import type { EffectiveCounter } from "@/server/register/tree";

export type Lookup = {
  counters: Map<string, RegisterCounter>;
  components: Map<string, RegisterComponent>;
};

export function lookupOf(view: { counters: RegisterCounter[]; components: RegisterComponent[] }): Lookup {
  return {
    counters: new Map(view.counters.map((c) => [c.id, c])),
    components: new Map(view.components.map((c) => [c.id, c])),
  };
}

/** "Main engine", "uses Main engine of ME", or "no counter". */
export function counterWords(
  effective: EffectiveCounter,
  lookup: Lookup,
): { text: string; inherited: boolean; none: boolean } {
  if (effective.kind === "none") return { text: "no counter", inherited: false, none: true };
  const counter = lookup.counters.get(effective.counterId);
  const name = counter ? `${counter.name}${counter.retiredAt ? " (retired)" : ""}` : "a counter no longer listed";
  if (effective.kind === "own") return { text: name, inherited: false, none: false };
  const from = lookup.components.get(effective.fromComponentId);
  return { text: `uses ${name} of ${from?.code ?? "a component above"}`, inherited: true, none: false };
}

/** What a component without a counter of its own would use under `parentId`. */
export function inheritedUnder(parentId: string | null, lookup: Lookup): string {
  const parent = parentId ? lookup.components.get(parentId) : undefined;
  if (!parent) return "no counter: nothing above it has one";
  const effective = parent.effectiveCounter;
  if (effective.kind === "none") return "no counter: nothing above it has one";
  const name = lookup.counters.get(effective.counterId)?.name ?? "a counter";
  const fromCode =
    effective.kind === "own" ? parent.code : (lookup.components.get(effective.fromComponentId)?.code ?? parent.code);
  return `${name} of ${fromCode}`;
}

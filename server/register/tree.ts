// The machinery register as a tree: built from flat rows, with each component's effective counter
// (PRODUCT.md: "a component uses its own counter or inherits its parent's"). Pure, so the page and
// the server share it.

export type TreeRow = {
  id: string;
  parentId: string | null;
  code: string;
  counterId: string | null;
  sortOrder?: number;
};

export type TreeNode<T extends TreeRow> = { row: T; depth: number; children: TreeNode<T>[] };

export type EffectiveCounter =
  | { kind: "own"; counterId: string }
  | { kind: "inherited"; counterId: string; fromComponentId: string }
  | { kind: "none" };

function bySortThenCode(a: TreeRow, b: TreeRow): number {
  return (a.sortOrder ?? 0) - (b.sortOrder ?? 0) || a.code.localeCompare(b.code, "en", { numeric: true });
}

/**
 * The forest of components, siblings by sort order then code. A row whose parent is missing, or
 * that sits on a loop of parents (which the database cannot stop on its own), becomes a root
 * rather than vanishing from the register.
 */
export function buildTree<T extends TreeRow>(rows: readonly T[]): TreeNode<T>[] {
  const ids = new Set(rows.map((r) => r.id));
  const childrenOf = new Map<string | null, T[]>();
  for (const row of rows) {
    const parent = row.parentId !== null && ids.has(row.parentId) ? row.parentId : null;
    const list = childrenOf.get(parent) ?? [];
    list.push(row);
    childrenOf.set(parent, list);
  }
  for (const list of childrenOf.values()) list.sort(bySortThenCode);

  const placed = new Set<string>();
  const grow = (row: T, depth: number): TreeNode<T> => {
    placed.add(row.id);
    const children = (childrenOf.get(row.id) ?? []).filter((c) => !placed.has(c.id)).map((c) => grow(c, depth + 1));
    return { row, depth, children };
  };
  const roots = (childrenOf.get(null) ?? []).map((r) => grow(r, 0));
  for (const row of [...rows].sort(bySortThenCode)) {
    if (!placed.has(row.id)) roots.push(grow(row, 0));
  }
  return roots;
}

/** Every node depth-first, parents before their children: the order the page lists them in. */
export function inTreeOrder<T extends TreeRow>(roots: readonly TreeNode<T>[]): TreeNode<T>[] {
  const out: TreeNode<T>[] = [];
  const visit = (node: TreeNode<T>) => {
    out.push(node);
    node.children.forEach(visit);
  };
  roots.forEach(visit);
  return out;
}

/** Each component's counter: its own, else the nearest ancestor's that has one, else none. */
export function resolveCounters(rows: readonly TreeRow[]): Map<string, EffectiveCounter> {
  const byId = new Map(rows.map((r) => [r.id, r]));
  const result = new Map<string, EffectiveCounter>();
  for (const row of rows) {
    if (row.counterId) {
      result.set(row.id, { kind: "own", counterId: row.counterId });
      continue;
    }
    let found: EffectiveCounter = { kind: "none" };
    const seen = new Set([row.id]);
    let parent = row.parentId ? byId.get(row.parentId) : undefined;
    while (parent && !seen.has(parent.id)) {
      if (parent.counterId) {
        found = { kind: "inherited", counterId: parent.counterId, fromComponentId: parent.id };
        break;
      }
      seen.add(parent.id);
      parent = parent.parentId ? byId.get(parent.parentId) : undefined;
    }
    result.set(row.id, found);
  }
  return result;
}

/** The ids below a component, at any depth (not the component itself). */
export function descendantIds(rows: readonly TreeRow[], componentId: string): Set<string> {
  const childrenOf = new Map<string, string[]>();
  for (const row of rows) {
    if (row.parentId === null) continue;
    const list = childrenOf.get(row.parentId) ?? [];
    list.push(row.id);
    childrenOf.set(row.parentId, list);
  }
  const found = new Set<string>();
  const stack = [...(childrenOf.get(componentId) ?? [])];
  while (stack.length) {
    const id = stack.pop()!;
    if (id === componentId || found.has(id)) continue;
    found.add(id);
    stack.push(...(childrenOf.get(id) ?? []));
  }
  return found;
}

/**
 * Whether putting `componentId` under `newParentId` would make it a part of itself: the new
 * parent is the component, or lies somewhere below it.
 */
export function wouldCreateCycle(rows: readonly TreeRow[], componentId: string, newParentId: string | null): boolean {
  if (newParentId === null) return false;
  const byId = new Map(rows.map((r) => [r.id, r]));
  const seen = new Set<string>();
  let current: string | null = newParentId;
  while (current !== null && !seen.has(current)) {
    if (current === componentId) return true;
    seen.add(current);
    current = byId.get(current)?.parentId ?? null;
  }
  return false;
}

/**
 * The components that match, with every ancestor of a match so that the tree still reads from
 * the top; used by the register's filter.
 */
export function matchesWithAncestors<T extends TreeRow>(rows: readonly T[], matches: (row: T) => boolean): Set<string> {
  const byId = new Map(rows.map((r) => [r.id, r]));
  const keep = new Set<string>();
  for (const row of rows) {
    if (!matches(row)) continue;
    let current: T | undefined = row;
    while (current && !keep.has(current.id)) {
      keep.add(current.id);
      current = current.parentId ? byId.get(current.parentId) : undefined;
    }
  }
  return keep;
}

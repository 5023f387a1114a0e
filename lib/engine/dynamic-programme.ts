import type { GridTables } from "./grid-tables";
import type { TrainStageType } from "./types";

/** Best grid design of one sequence: objective and the grid index of every stage boundary (0 .. m-1). */
export interface GridDesign {
  readonly value: number;
  readonly boundaries: number[];
}

interface TrieNode {
  readonly type: TrainStageType;
  readonly parent: TrieNode | null;
  readonly children: Map<TrainStageType, TrieNode>;
  best: Float64Array;
  from: Int32Array;
}

function buildTrie(sequences: readonly (readonly TrainStageType[])[]): { roots: Map<TrainStageType, TrieNode>; leaves: TrieNode[] } {
  const roots = new Map<TrainStageType, TrieNode>();
  const leaves = sequences.map((seq) => {
    let level = roots;
    let node: TrieNode | null = null;
    for (const type of seq) {
      let next = level.get(type);
      if (!next) {
        next = { type, parent: node, children: new Map(), best: new Float64Array(0), from: new Int32Array(0) };
        level.set(type, next);
      }
      node = next;
      level = next.children;
    }
    return node as TrieNode;
  });
  return { roots, leaves };
}

/** best[j] = min over i <= j of parent[i] + stage(i -> j); only j = m-1 when nothing builds on the node. */
function relax(node: TrieNode, tables: GridTables): void {
  const { m } = tables;
  const table = tables.later[node.type];
  const prev = (node.parent as TrieNode).best;
  const best = new Float64Array(m).fill(Infinity);
  const from = new Int32Array(m).fill(-1);
  const lo = node.children.size > 0 ? 0 : m - 1;
  for (let j = lo; j < m; j++) {
    let v = Infinity;
    let arg = -1;
    for (let i = 0; i <= j; i++) {
      const c = prev[i] + table[i * m + j];
      if (c < v) {
        v = c;
        arg = i;
      }
    }
    best[j] = v;
    from[j] = arg;
  }
  node.best = best;
  node.from = from;
}

function visit(node: TrieNode, tables: GridTables): void {
  if (node.parent === null) {
    node.best = tables.first[node.type];
    node.from = new Int32Array(tables.m);
  } else {
    relax(node, tables);
  }
  for (const child of node.children.values()) visit(child, tables);
}

/**
 * Globally optimal grid designs of many sequences at once. Sequences sharing a prefix share its work:
 * the trie of prefixes is walked once, each node costing one min-plus pass over the grid tables.
 */
export function optimiseOnGrid(tables: GridTables, sequences: readonly (readonly TrainStageType[])[]): GridDesign[] {
  const { roots, leaves } = buildTrie(sequences);
  for (const root of roots.values()) visit(root, tables);
  return leaves.map((leaf) => {
    const boundaries: number[] = [];
    let j = tables.m - 1;
    let node: TrieNode | null = leaf;
    const value = leaf.best[j];
    while (node) {
      boundaries.unshift(j);
      j = node.parent ? node.from[j] : 0;
      node = node.parent;
    }
    boundaries.unshift(0);
    return { value, boundaries };
  });
}

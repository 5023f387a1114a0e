/**
 * Fills of the stages in every chart and in the PDF: each stage its own colour and its own pattern
 * (hatch direction, dots, grid), so that stages stay apart in grey print and for readers who do
 * not tell the colours apart. Plain data, no React: the PDF writer draws the same patterns.
 */
export const STAGE_STYLES = [
  { fill: "#cfe9e5", stroke: "#136f67", kind: "diagonal" },
  { fill: "#fde4c8", stroke: "#b45309", kind: "dots" },
  { fill: "#dde3fb", stroke: "#3f51b5", kind: "antidiagonal" },
  { fill: "#f9d8e4", stroke: "#a21caf", kind: "grid" },
  { fill: "#e4f1cf", stroke: "#4d7c0f", kind: "horizontal" },
  { fill: "#fbe9a8", stroke: "#854d0e", kind: "vertical" },
  { fill: "#dcecf8", stroke: "#0369a1", kind: "cross" },
  { fill: "#ece2f7", stroke: "#6d28d9", kind: "rings" },
] as const;

export type StageStyle = (typeof STAGE_STYLES)[number];

/** The style of the stage at `index` (0-based); the list repeats past its end. */
export function stageStyle(index: number): StageStyle {
  const n = STAGE_STYLES.length;
  return STAGE_STYLES[((index % n) + n) % n]!;
}

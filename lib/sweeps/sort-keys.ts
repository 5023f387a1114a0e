/**
 * Columns the ranked table may be sorted by. One list for the candidates endpoint's query schema
 * (lib/schemas/sweeps.ts) and the sweep page's URL state (components/sweeps/view-state.ts); it has
 * no dependencies so the page takes it without pulling zod or the server in.
 */
export const SORT_KEYS = ["rank", "totalVolume", "totalCost", "stageCount", "ratioToPfr", "sequence", "installedCost", "reused", "probabilityMeet", "conversion", "yield", "selectivity", "objectiveValue"] as const;
export type SortKey = (typeof SORT_KEYS)[number];

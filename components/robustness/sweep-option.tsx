"use client";

import { labelFor } from "@/lib/schemas/field-labels";
import { spreadFractionFromPercent } from "./spread-percent";
import { sweepRobustnessSchema, ROBUSTNESS_FIELD_LABELS, ROBUSTNESS_FIELDS, type SweepRobustness } from "@/lib/schemas/robustness";

export interface SweepOptionState {
  enabled: boolean;
  field: (typeof ROBUSTNESS_FIELDS)[number];
  percent: string;
  samples: string;
  seed: string;
}

export const SWEEP_OPTION_OFF: SweepOptionState = { enabled: false, field: "reaction.rate.k", percent: "20", samples: "200", seed: "1" };

/** The request's `robustness` member, or a message naming what is wrong; null when the option is off. */
export function sweepOptionValue(s: SweepOptionState): { value: SweepRobustness | null; error?: string } {
  if (!s.enabled) return { value: null };
  const parsed = sweepRobustnessSchema.safeParse({
    uncertain: [{ field: s.field, kind: "plusMinus", fraction: spreadFractionFromPercent(s.percent) }],
    samples: Number(s.samples),
    seed: Number(s.seed),
  });
  if (parsed.success) return { value: parsed.data };
  return { value: null, error: parsed.error.issues.map((i) => `${labelFor(i.path.map(String))}: ${i.message}`).join("; ") };
}

/** "Also rate every feasible train under uncertainty": one input ± a percentage, samples and seed. */
export function SweepRobustnessOption({ state, onChange, error }: { state: SweepOptionState; onChange: (s: SweepOptionState) => void; error?: string }) {
  const set = (patch: Partial<SweepOptionState>) => onChange({ ...state, ...patch });
  return (
    <fieldset className="card space-y-3 p-4" data-testid="sweep-robustness">
      <legend className="px-1 text-base font-semibold">Uncertainty</legend>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" checked={state.enabled} onChange={(e) => set({ enabled: e.target.checked })} /> Also rate every feasible train under uncertainty
      </label>
      {state.enabled ? (
        <div className="flex flex-wrap items-end gap-3">
          <div>
            <label htmlFor="sr-field" className="field-label">
              Uncertain input
            </label>
            <select id="sr-field" className="input" value={state.field} onChange={(e) => set({ field: e.target.value as SweepOptionState["field"] })}>
              {ROBUSTNESS_FIELDS.map((f) => (
                <option key={f} value={f}>
                  {ROBUSTNESS_FIELD_LABELS[f].label}
                </option>
              ))}
            </select>
          </div>
          <div>
            <label htmlFor="sr-percent" className="field-label">
              ± %
            </label>
            <input id="sr-percent" className="input num w-20" inputMode="decimal" value={state.percent} onChange={(e) => set({ percent: e.target.value })} />
          </div>
          <div>
            <label htmlFor="sr-samples" className="field-label">
              Samples per train (100–2,000)
            </label>
            <input id="sr-samples" className="input num w-24" inputMode="numeric" value={state.samples} onChange={(e) => set({ samples: e.target.value })} />
          </div>
          <div>
            <label htmlFor="sr-seed" className="field-label">
              Random seed (repeatable draws)
            </label>
            <input id="sr-seed" className="input num w-20" inputMode="numeric" value={state.seed} onChange={(e) => set({ seed: e.target.value })} />
          </div>
        </div>
      ) : null}
      {state.enabled ? <p className="text-xs text-ink-soft">The ranked table gains a sortable column “P(meet target)”. Each train adds its samples to the sweep&apos;s run time.</p> : null}
      {error ? (
        <p className="field-error" role="alert">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}

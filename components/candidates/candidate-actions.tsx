import { RobustnessPanel } from "@/components/robustness/robustness-panel";
import { PinForm } from "./pin-form";

/** The candidate, as far as pinning it and rating its robustness need it. */
interface Actionable {
  id: string;
  feasible: boolean;
  sweep: { projectId: string };
}

/** Pinning a candidate to its project: the same section for trains of one reaction and of several. */
export function PinSection({ c, canPin }: { c: Actionable; canPin: boolean }) {
  return (
    <section className="card p-4" aria-labelledby="pin-title">
      <h2 id="pin-title">Pin to project</h2>
      <div className="mt-2">
        <PinForm candidateId={c.id} projectId={c.sweep.projectId} feasible={c.feasible} canPin={canPin} />
      </div>
    </section>
  );
}

/** Rating a feasible candidate's robustness; an infeasible one has nothing to rate, so shows nothing. */
export function RobustnessSection({ c, canRun }: { c: Actionable; canRun: boolean }) {
  if (!c.feasible) return null;
  return (
    <section className="card p-4" aria-labelledby="robustness-title">
      <h2 id="robustness-title">Robustness</h2>
      <RobustnessPanel base={`/api/candidates/${c.id}`} canRun={canRun} />
    </section>
  );
}

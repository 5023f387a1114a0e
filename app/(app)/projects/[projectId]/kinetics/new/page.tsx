import Link from "next/link";
import { ProjectCrumbs } from "@/components/layout/breadcrumbs";
import { defaultKineticsValues } from "@/components/kinetics/kinetics-form-state";
import { KineticsEditor } from "@/components/kinetics/kinetics-editor";
import { defaultNetworkValues } from "@/components/kinetics/network-form-state";
import { NetworkEditor } from "@/components/kinetics/network-editor";
import { loadProjectPage } from "../../project-data";
import { can } from "@/lib/authz/policy";

export const dynamic = "force-dynamic";
export const metadata = { title: "New kinetics" };

const KINDS = [
  ["one", "One reaction", "A single reaction of A: Levenspiel plot and the usual rate laws."],
  ["several", "Several reactions", "Side and series reactions: trains chosen for yield, selectivity or volume."],
] as const;

export default async function NewKineticsPage({ params, searchParams }: { params: Promise<{ projectId: string }>; searchParams: Promise<{ kind?: string }> }) {
  const { projectId } = await params;
  const { kind } = await searchParams;
  const several = kind === "several";
  const { actor, project } = await loadProjectPage(projectId);
  return (
    <div className="space-y-4">
      <ProjectCrumbs project={project} here="New kinetics" />
      <div>
        <h1>New kinetics</h1>
        <p className="text-ink-soft">
          {several ? "Feed and species, the reactions and their rate laws." : "Feed, reaction, rate law and thermal mode."} Every number is stored in SI, whatever unit you type it in.
        </p>
      </div>
      {can(actor, "kinetics.create") ? (
        <>
          <nav aria-label="Kind of model" className="grid gap-1.5 sm:grid-cols-2">
            {KINDS.map(([value, title, text]) => {
              const current = (value === "several") === several;
              return (
                <Link
                  key={value}
                  href={`/projects/${project.id}/kinetics/new${value === "several" ? "?kind=several" : ""}`}
                  aria-current={current ? "page" : undefined}
                  className={`rounded border p-2 text-sm ${current ? "border-accent-500 bg-accent-50" : "border-line hover:bg-paper"}`}
                >
                  <span className="font-medium">{title}</span>
                  <span className="block text-xs text-ink-soft">{text}</span>
                </Link>
              );
            })}
          </nav>
          {several ? (
            <NetworkEditor mode={{ kind: "create", projectId: project.id }} initial={defaultNetworkValues()} />
          ) : (
            <KineticsEditor mode={{ kind: "create", projectId: project.id }} initial={defaultKineticsValues()} />
          )}
        </>
      ) : (
        <p className="card p-4 text-ink-soft">Your role lets you read pinned designs but not define kinetics.</p>
      )}
    </div>
  );
}

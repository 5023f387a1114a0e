import Link from "next/link";

/** Links from the project page to its cost basis and to rating a fixed train. */
export function ProjectCostLinks({ projectId, canRate }: { projectId: string; canRate: boolean }) {
  return (
    <p className="mt-2 flex flex-wrap gap-2 text-sm">
      <Link href={`/projects/${projectId}/costs`} className="btn-quiet py-1" data-testid="project-costs-link">
        Cost basis
      </Link>
      {canRate ? (
        <Link href={`/projects/${projectId}/rate`} className="btn-quiet py-1" data-testid="project-rate-link">
          Rate a fixed train
        </Link>
      ) : null}
    </p>
  );
}

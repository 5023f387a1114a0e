import Link from "next/link";

/** Projects / <project> / <here>, above a project's sub-pages. */
export function ProjectCrumbs({ project, here }: { project: { id: string; name: string }; here: string }) {
  return (
    <nav aria-label="Breadcrumb" className="text-sm text-ink-soft">
      <Link href="/" className="hover:underline">
        Projects
      </Link>{" "}
      /{" "}
      <Link href={`/projects/${project.id}`} className="hover:underline">
        {project.name}
      </Link>{" "}
      / <span aria-current="page">{here}</span>
    </nav>
  );
}

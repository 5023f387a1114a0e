import Link from "next/link";

export default function NotFound() {
  return (
    <main id="main-content" tabIndex={-1} className="grid min-h-[60vh] place-items-center px-4">
      <div className="card max-w-sm p-6 text-center">
        <h1>Not found</h1>
        <p className="mt-2 text-ink-soft">There is nothing here, or it belongs to another team.</p>
        <Link href="/" className="mt-4 inline-block text-accent-700 underline">
          Back to projects
        </Link>
      </div>
    </main>
  );
}

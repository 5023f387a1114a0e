import type { WordLine } from "@/lib/reports/kinetics-words";

/** One titled card of a report; the title labels the section so screen readers can jump between them. */
export function Section({ id, title, children }: { id: string; title: string; children: React.ReactNode }) {
  return (
    <section className="report-section card p-4" aria-labelledby={id}>
      <h2 id={id} className="mb-2">
        {title}
      </h2>
      {children}
    </section>
  );
}

/** Label and value lines of a report, as a two-column list. */
export function Pairs({ lines }: { lines: WordLine[] }) {
  return (
    <dl className="grid gap-x-4 gap-y-0.5 text-sm sm:grid-cols-[14rem_1fr]">
      {lines.map((l, i) => (
        <div key={`${l.label}-${i}`} className="contents">
          <dt className="text-ink-soft">{l.label}</dt>
          <dd>{l.value}</dd>
        </div>
      ))}
    </dl>
  );
}

/** A column of the report's stage table: its heading, how a stage shows in it, and whether it is a number. */
export interface ShownColumn<S> {
  heading: string;
  numeric: boolean;
  shown: (s: S) => string;
}

/**
 * The report's stage table, one row a stage. One train of one reaction and one of several share it,
 * so both read the same; only the columns differ.
 */
export function StageTable<S extends { index: number }>({ columns, stages }: { columns: ShownColumn<S>[]; stages: S[] }) {
  return (
    <div className="overflow-x-auto">
      <table className="table-dense" data-testid="report-stage-table">
        <thead>
          <tr>
            {columns.map((c) => (
              <th key={c.heading} scope="col" className={c.numeric ? "text-right" : undefined}>
                {c.heading}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {stages.map((s) => (
            <tr key={s.index}>
              {columns.map((c) => (
                <td key={c.heading} className={c.numeric ? "num text-right whitespace-nowrap" : undefined}>
                  {c.shown(s)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

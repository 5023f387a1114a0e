"use client";

/** Print, PDF, JSON and CSV of a design report; hidden when printing. */
export function ReportActions({ pinId }: { pinId: string }) {
  return (
    <div className="report-actions flex flex-wrap gap-2" role="group" aria-label="Report actions">
      <button type="button" className="btn-primary" onClick={() => window.print()} data-testid="report-print">
        Print
      </button>
      <a className="btn-quiet" href={`/api/pins/${pinId}/report.pdf`} download data-testid="report-pdf">
        PDF
      </a>
      <a className="btn-quiet" href={`/api/pins/${pinId}/export.json`} download data-testid="report-json">
        JSON
      </a>
      <a className="btn-quiet" href={`/api/pins/${pinId}/export.csv`} download data-testid="report-csv">
        CSV
      </a>
    </div>
  );
}

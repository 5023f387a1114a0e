import Link from "next/link";
import { FIT_LAW_INFO, type FitLaw, type FitParameterOut } from "@/lib/schemas/fits";
import { valuePlusMinus } from "./fit-format";
import { formatNumber, RECORD_NUMBERS } from "@/lib/format/numbers";

interface Source {
  kind: string;
  fit: Record<string, unknown> | null;
  datasetId: string;
  datasetName: string;
  datasetVersion: number;
}

/** "Fitted to <dataset> vN — power law, k = … ± …, n = … ± …, R² = …", linking to the fit screen. */
export function FitSourceLine({ projectId, source, testId = "kinetics-source" }: { projectId: string; source: Source; testId?: string }) {
  const href = `/projects/${projectId}/datasets/${source.datasetId}/fit?version=${source.datasetVersion}`;
  const fit = source.fit as { law?: FitLaw; parameters?: FitParameterOut[]; rSquared?: number } | null;
  const link = (
    <Link href={href} className="underline">
      {source.datasetName} v{source.datasetVersion}
    </Link>
  );
  if (source.kind !== "fit" || !fit?.law) {
    return <span className="block text-xs" data-testid={testId}>Measured table from {link}</span>;
  }
  const params = (fit.parameters ?? []).map(valuePlusMinus).join(", ");
  return (
    <span className="block text-xs text-ink" data-testid={testId}>
      Fitted to {link} — {FIT_LAW_INFO[fit.law].label.toLowerCase()}, {params}, R² = {formatNumber(fit.rSquared, 5, RECORD_NUMBERS)}
    </span>
  );
}

"use client";

import { useState } from "react";
import { defaultBuilderValues } from "./builder-form-state";
import { defaultNetworkValues } from "./network-builder-form-state";
import { NetworkBuilder, type AnyVersionOption } from "./network-builder";
import { SweepBuilder, type VersionOption } from "./sweep-builder";

/**
 * The new-sweep form for the chosen kinetics version's kind: one reaction (target conversion, cost)
 * or several reactions (yield, selectivity, limits). Choosing a version of the other kind in either
 * form swaps the form, starting from that model's defaults.
 */
export function SweepBuilderByKind({ projectId, versions, initialVersionId }: { projectId: string; versions: (VersionOption & AnyVersionOption)[]; initialVersionId: string }) {
  const [versionId, setVersionId] = useState(initialVersionId);
  const network = versions.find((o) => o.id === versionId)?.network;
  if (network) return <NetworkBuilder key={`network-${versionId}`} projectId={projectId} versions={versions} initial={defaultNetworkValues(network)} onVersionChange={setVersionId} />;
  return <SweepBuilder key="single" projectId={projectId} versions={versions} initial={defaultBuilderValues(versionId)} onVersionChange={setVersionId} />;
}

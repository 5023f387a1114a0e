import { z } from "zod";
import { displayUnitsSchema } from "@/lib/schemas/display-units";
import { auditQuerySchema } from "./schemas/audit";
import { candidateExportQuerySchema } from "./schemas/report-exports";
import { invitationAcceptSchema, invitationCreateSchema, memberUpdateSchema } from "./schemas/accounts";
import { projectCreateSchema, projectUpdateSchema } from "./schemas/projects";
import {
  candidateQuerySchema,
  compareQuerySchema,
  kineticsModelCreateSchema,
  kineticsPreviewSchema,
  kineticsVersionCreateSchema,
  networkKineticsModelCreateSchema,
  networkKineticsVersionCreateSchema,
  networkSweepCreateSchema,
  pinCreateSchema,
  reviewSchema,
  sweepCreateSchema,
  tokenCreateSchema,
} from "./schemas/sweeps";
import { fitRequestSchema, fitSaveSchema } from "./schemas/fits";
import { costBasisSchema, rateRequestSchema } from "./schemas/costs";
import { inventoryVesselSchema, inventoryVesselUpdateSchema } from "./schemas/inventory";
import { networkPreviewSchema } from "./schemas/network-preview";
import { createFormDoc, previewFormDoc, tableKineticsSchema, versionFormDoc } from "./schemas/datasets";
import { robustnessCreateSchema } from "./schemas/robustness";

type Method = "get" | "post" | "put" | "patch" | "delete";

interface Endpoint {
  method: Method;
  path: string;
  summary: string;
  body?: z.ZodType;
  /** A multipart/form-data body (file uploads). */
  form?: z.ZodType;
  query?: z.ZodObject;
  /** Success status. */
  status?: number;
  public?: boolean;
}

/** Every route handler of the JSON API; a unit test checks this list against app/api. */
export const ENDPOINTS: Endpoint[] = [
  { method: "get", path: "/api/health", summary: "200 once the app reaches its database", public: true },
  { method: "get", path: "/api/me", summary: "The signed-in user, active team and role" },
  { method: "post", path: "/api/me/team", summary: "Switch the active team", body: z.object({ teamId: z.uuid() }) },
  { method: "get", path: "/api/me/display-units", summary: "The units results are shown in for the signed-in user" },
  { method: "put", path: "/api/me/display-units", summary: "Choose the units results are shown in", body: displayUnitsSchema },
  { method: "get", path: "/api/projects", summary: "Projects of the team (?archived=include)" },
  { method: "post", path: "/api/projects", summary: "Create a project", body: projectCreateSchema, status: 201 },
  { method: "get", path: "/api/projects/{projectId}", summary: "Read a project" },
  { method: "patch", path: "/api/projects/{projectId}", summary: "Rename, describe, archive or restore a project", body: projectUpdateSchema },
  { method: "get", path: "/api/team/members", summary: "Members of the team (admins)" },
  { method: "patch", path: "/api/team/members/{userId}", summary: "Change a member's role (admins)", body: memberUpdateSchema },
  { method: "delete", path: "/api/team/members/{userId}", summary: "Remove a member (admins)", status: 204 },
  { method: "get", path: "/api/team/invitations", summary: "Open invitations (admins)" },
  { method: "post", path: "/api/team/invitations", summary: "Invite by e-mail (admins)", body: invitationCreateSchema, status: 201 },
  { method: "delete", path: "/api/team/invitations/{invitationId}", summary: "Revoke an invitation (admins)", status: 204 },
  { method: "post", path: "/api/invitations/accept", summary: "Accept an invitation: creates the account", body: invitationAcceptSchema, status: 201, public: true },
  { method: "get", path: "/api/audit", summary: "The team's audit trail (?entityType=&entityId=)", query: auditQuerySchema },
  { method: "get", path: "/api/projects/{projectId}/kinetics", summary: "Kinetics models of a project, with their latest version" },
  { method: "post", path: "/api/projects/{projectId}/kinetics", summary: "Create a kinetics model (version 1): one reaction, or several (a spec with reactions)", body: z.union([kineticsModelCreateSchema, networkKineticsModelCreateSchema]), status: 201 },
  { method: "get", path: "/api/kinetics/{modelId}", summary: "A kinetics model with every version" },
  { method: "post", path: "/api/kinetics/{modelId}/versions", summary: "Save a new version of a kinetics model (of the model's kind; 409 otherwise)", body: z.union([kineticsVersionCreateSchema, networkKineticsVersionCreateSchema]), status: 201 },
  { method: "post", path: "/api/kinetics/preview", summary: "Live charts of a draft, without queueing: one reaction's Levenspiel curve, equilibrium limit and single-stage references; or, for several reactions (a spec with reactions), the concentration paths of a single tube and single stirred tanks from the feed with the instantaneous selectivity", body: z.union([kineticsPreviewSchema, networkPreviewSchema]) },
  { method: "post", path: "/api/dataset-versions/{versionId}/fits", summary: "Fit rate laws to a dataset version: parameters with standard errors and 95 % intervals, RSS, R², AIC, parity and residuals (nothing stored)", body: fitRequestSchema },
  { method: "post", path: "/api/dataset-versions/{versionId}/kinetics", summary: "Refit one law and save it as a kinetics model or a new version, with the dataset version as its source", body: fitSaveSchema, status: 201 },
  { method: "get", path: "/api/projects/{projectId}/sweeps", summary: "Sweeps of a project, newest first" },
  { method: "post", path: "/api/projects/{projectId}/sweeps", summary: "Submit a sweep: kinetics version, target, train space, objective, scenario grid; for a model of several reactions heat mode, trains, what to rank by and limits instead of a target", body: z.union([sweepCreateSchema, networkSweepCreateSchema]), status: 201 },
  { method: "get", path: "/api/sweeps/{sweepId}", summary: "A sweep with its progress" },
  { method: "post", path: "/api/sweeps/{sweepId}/cancel", summary: "Cancel a queued or running sweep" },
  { method: "post", path: "/api/sweeps/{sweepId}/rerun", summary: "Run the same sweep again as a new sweep", status: 201 },
  { method: "get", path: "/api/sweeps/{sweepId}/scenarios", summary: "Scenarios of a sweep with their status and best objective" },
  { method: "get", path: "/api/sweeps/{sweepId}/scenarios/{index}/candidates", summary: "Ranked candidates of one scenario, sorted, filtered and paged; once the sweep has ended each answer carries an ETag, and a repeat sending it in If-None-Match gets 304 Not Modified", query: candidateQuerySchema },
  { method: "get", path: "/api/candidates/compare", summary: "Two to four candidates side by side", query: compareQuerySchema },
  { method: "get", path: "/api/candidates/{candidateId}", summary: "One candidate with its stages, plot data, scenario and sweep; of several reactions also its chemistry, concentration profiles and paths" },
  { method: "post", path: "/api/candidates/{candidateId}/pin", summary: "Pin a candidate to its project for review", body: pinCreateSchema, status: 201 },
  { method: "get", path: "/api/projects/{projectId}/pins", summary: "Pinned designs of a project (viewers: approved only)" },
  { method: "get", path: "/api/pins/{pinId}", summary: "A pinned design with its frozen candidate and spec" },
  { method: "get", path: "/api/reviews", summary: "Designs waiting for the signed-in manager's review, oldest first, with their count" },
  { method: "post", path: "/api/pins/{pinId}/review", summary: "Approve or reject a proposed design (managers)", body: reviewSchema },
  { method: "get", path: "/api/pins/{pinId}/report.pdf", summary: "The design report of a pinned design as an A4 PDF (attachment)" },
  { method: "get", path: "/api/pins/{pinId}/export.json", summary: "The design report of a pinned design as JSON, with the cautions (attachment)" },
  { method: "get", path: "/api/pins/{pinId}/export.csv", summary: "The stage table of a pinned design as CSV, units in the headers (attachment)" },
  { method: "get", path: "/api/sweeps/{sweepId}/scenarios/{index}/candidates/export", summary: "Every candidate of one scenario as CSV or JSON, sorted and filtered as the ranked table", query: candidateExportQuerySchema },
  { method: "post", path: "/api/candidates/{candidateId}/robustness", summary: "Rate a candidate's train by Monte Carlo under uncertain inputs (201 done, 202 queued)", body: robustnessCreateSchema, status: 201 },
  { method: "get", path: "/api/candidates/{candidateId}/robustness", summary: "A candidate's robustness runs, newest first, and the numeric inputs it offers" },
  { method: "post", path: "/api/pins/{pinId}/robustness", summary: "Rate a pinned design's train by Monte Carlo under uncertain inputs (201 done, 202 queued)", body: robustnessCreateSchema, status: 201 },
  { method: "get", path: "/api/pins/{pinId}/robustness", summary: "A pinned design's robustness runs, newest first, and the numeric inputs it offers" },
  { method: "get", path: "/api/robustness/{runId}", summary: "One robustness run: queued, running, succeeded (with P5/P50/P95 and the probability of missing the target) or failed" },
  { method: "get", path: "/api/tokens", summary: "Your personal API tokens (never the tokens themselves)" },
  { method: "post", path: "/api/tokens", summary: "Create a personal API token; shown once", body: tokenCreateSchema, status: 201 },
  { method: "delete", path: "/api/tokens/{tokenId}", summary: "Revoke a personal API token", status: 204 },
  { method: "post", path: "/api/projects/{projectId}/datasets/preview", summary: "Read an uploaded CSV or XLSX of measured rates with a column mapping: rows in SI and problems per row; stores nothing", form: previewFormDoc },
  { method: "get", path: "/api/projects/{projectId}/datasets", summary: "Rate datasets of a project, with their latest version" },
  { method: "post", path: "/api/projects/{projectId}/datasets", summary: "Create a rate dataset (version 1) from a clean upload; a file with bad rows is refused", form: createFormDoc, status: 201 },
  { method: "get", path: "/api/datasets/{datasetId}", summary: "A rate dataset with every version (without rows)" },
  { method: "post", path: "/api/datasets/{datasetId}/versions", summary: "Add a version to a rate dataset from a clean upload", form: versionFormDoc, status: 201 },
  { method: "get", path: "/api/dataset-versions/{versionId}", summary: "One dataset version: SI rows and the mapping they were read with" },
  { method: "post", path: "/api/dataset-versions/{versionId}/table-kinetics", summary: "Use a dataset version as a measured rate table: creates a kinetics model or a new version of one", body: tableKineticsSchema, status: 201 },
  { method: "get", path: "/api/openapi.json", summary: "This document", public: true },
  { method: "get", path: "/api/projects/{projectId}/costs", summary: "A project's cost basis (the defaults until one is saved), its standard sizes and the sweep objective it gives" },
  { method: "put", path: "/api/projects/{projectId}/costs", summary: "Save a project's cost basis: correlations with sources, currency and year, standard sizes, largest vessel, installation factor", body: costBasisSchema },
  { method: "post", path: "/api/projects/{projectId}/rate", summary: "Rate a fixed train: stage-by-stage conversion and the largest feed of A that still reaches the target", body: rateRequestSchema },
  { method: "get", path: "/api/inventory", summary: "The team's idle vessels" },
  { method: "post", path: "/api/inventory", summary: "Add an idle vessel (volume in m3)", body: inventoryVesselSchema, status: 201 },
  { method: "get", path: "/api/inventory/{vesselId}", summary: "One idle vessel" },
  { method: "patch", path: "/api/inventory/{vesselId}", summary: "Change an idle vessel", body: inventoryVesselUpdateSchema },
  { method: "delete", path: "/api/inventory/{vesselId}", summary: "Remove an idle vessel", status: 204 },
  { method: "post", path: "/api/inventory/import", summary: "Upload a CSV or XLSX of vessels (multipart: file, accept=true|false): preview with row problems, or import; 201 when imported" },
];

const errorSchema = {
  type: "object",
  properties: {
    error: {
      type: "object",
      required: ["code", "message"],
      properties: {
        code: { type: "string", enum: ["bad_request", "unsupported_media_type", "unauthorized", "forbidden", "not_found", "conflict", "payload_too_large", "rate_limited", "internal"] },
        message: { type: "string" },
        fields: { type: "object", additionalProperties: { type: "array", items: { type: "string" } }, description: "Field path → messages" },
      },
    },
  },
};

const jsonSchema = (s: z.ZodType) => z.toJSONSchema(s, { io: "input", unrepresentable: "any" });

/** The OpenAPI 3.1 document, generated from the same zod schemas the handlers validate with. */
export function buildOpenApiDocument(serverUrl: string) {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const e of ENDPOINTS) {
    const params = [...e.path.matchAll(/\{(\w+)\}/g)].map((m) => ({ name: m[1], in: "path", required: true, schema: { type: "string" } }));
    const query = e.query
      ? Object.entries(e.query.shape).map(([name, s]) => ({ name, in: "query", required: !(s as z.ZodType).safeParse(undefined).success, schema: jsonSchema(s as z.ZodType) }))
      : [];
    (paths[e.path] ??= {})[e.method] = {
      summary: e.summary,
      ...(e.public ? { security: [] } : {}),
      parameters: [...params, ...query],
      ...(e.body ? { requestBody: { required: true, content: { "application/json": { schema: jsonSchema(e.body) } } } } : {}),
      ...(e.form ? { requestBody: { required: true, content: { "multipart/form-data": { schema: jsonSchema(e.form) } } } } : {}),
      responses: {
        [String(e.status ?? 200)]: { description: "Success" },
        "400": { description: "Invalid input; error.fields names each bad field", content: { "application/json": { schema: errorSchema } } },
        "401": { description: "Not signed in, or the API token is not valid" },
        "403": { description: "Your role does not allow this" },
        "404": { description: "No such record in your team" },
        ...(e.form || e.path === "/api/inventory/import" ? { "413": { description: "The file is over the upload size limit; error.fields.file says so", content: { "application/json": { schema: errorSchema } } } } : {}),
      },
    };
  }
  return {
    openapi: "3.1.0",
    info: { title: "Seriatim API", version: "1", description: "Reactor-train sweeps, ranked candidates and pinned designs. All quantities SI unless a unit string is given." },
    servers: [{ url: serverUrl }],
    components: {
      securitySchemes: {
        session: { type: "apiKey", in: "cookie", name: "authjs.session-token" },
        token: { type: "http", scheme: "bearer", description: "Personal API token (srt_…), from POST /api/tokens" },
      },
    },
    security: [{ session: [] }, { token: [] }],
    paths,
  };
}

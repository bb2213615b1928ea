/**
 * The OpenAPI 3.1 document of the versioned JSON API, with request bodies generated from the
 * same zod schemas the routes validate with (zod's JSON Schema output), so it cannot drift
 * from what the server accepts.
 */
import { z } from "zod";
import { facilityModelSchema } from "@/lib/engine/model";
import { ledgerInputSchema } from "@/lib/engine/loads";
import { stateQuerySchema } from "@/lib/engine/thermo";
import { createFacilitySchema, updateFacilitySchema, archiveFacilitySchema, duplicateFacilitySchema } from "@/features/facilities/schema";
import { saveModelSchema, issueSchema } from "@/features/facilities/model-schema";
import { inviteSchema, changeRoleSchema, acceptInviteSchema } from "@/features/team/schema";
import { emailOnlySchema, resetSchema } from "@/features/auth/schema";
import { workspaceSettingsSchema } from "@/features/energy/schema";
import { monthlyWeatherSchema } from "@/features/energy/monthly";

const js = (s: z.ZodType) => z.toJSONSchema(s, { io: "input", unrepresentable: "any", target: "draft-2020-12" });

const errorSchema = {
  type: "object",
  required: ["error"],
  properties: {
    error: {
      type: "object",
      required: ["code", "message"],
      properties: {
        code: { type: "string", enum: ["unauthenticated", "forbidden", "not_found", "validation", "conflict", "rate_limited", "invalid_token", "last_owner", "calculation", "internal"] },
        message: { type: "string" },
        field: { type: "string", description: "Dotted path of the offending input, e.g. site.designDryBulbC or model.rooms.0.setPointC" },
        fields: { type: "array", items: { type: "object", properties: { field: { type: "string" }, message: { type: "string" } } } },
      },
    },
  },
};

function body(ref: string) {
  return { required: true, content: { "application/json": { schema: { $ref: `#/components/schemas/${ref}` } } } };
}
const ok = (description: string) => ({ description, content: { "application/json": { schema: { type: "object" } } } });
const errors = {
  "400": { description: "Invalid input; the error names the field and the allowed range", content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } } },
  "401": { description: "Not signed in", content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } } },
  "403": { description: "Your role may not do this, or a change sent from another site (Origin or Sec-Fetch-Site)", content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } } },
  "404": { description: "Not found, or not a member of the workspace", content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } } },
  "413": { description: "Body over the route's limit (1 MB; 4 MB for model documents); the message names the limit", content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } } },
  "415": { description: "A JSON body sent without Content-Type: application/json", content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } } },
};
const ws = { name: "ws", in: "path", required: true, schema: { type: "string" }, description: "Workspace slug" };
const id = { name: "id", in: "path", required: true, schema: { type: "string", format: "uuid" }, description: "Facility id" };
const jobId = { name: "jobId", in: "path", required: true, schema: { type: "string", format: "uuid" }, description: "Job id" };

export function openApiDocument(serverUrl: string) {
  return {
    openapi: "3.1.0",
    info: {
      title: "Rimeplan API",
      version: "1",
      description:
        "Refrigeration planning for cold-chain warehouses. SI units throughout (°C in names ending C, K for differences, W, Pa absolute). " +
        "Results are planning calculations: designs must follow local codes and be checked by licensed practice.",
    },
    servers: [{ url: serverUrl }],
    components: {
      securitySchemes: { session: { type: "apiKey", in: "cookie", name: "authjs.session-token" } },
      schemas: {
        Error: errorSchema,
        FacilityModel: js(facilityModelSchema),
        LedgerInput: js(ledgerInputSchema),
        CreateFacility: js(createFacilitySchema),
        UpdateFacility: js(updateFacilitySchema),
        DuplicateFacility: js(duplicateFacilitySchema),
        ArchiveFacility: js(archiveFacilitySchema),
        SaveModel: js(saveModelSchema),
        IssueRevision: js(issueSchema),
        Invite: js(inviteSchema),
        ChangeRole: js(changeRoleSchema),
        AcceptInvite: js(acceptInviteSchema),
        EmailOnly: js(emailOnlySchema),
        ResetPassword: js(resetSchema),
        StateQuery: js(stateQuerySchema),
        WorkspaceSettings: js(workspaceSettingsSchema),
        MonthlyWeather: js(monthlyWeatherSchema),
      },
    },
    security: [{ session: [] }],
    paths: {
      "/api/v1/health": { get: { summary: "Liveness and database check", security: [], responses: { "200": ok("Healthy"), "503": ok("Database unreachable") } } },
      "/api/v1/calculate": {
        post: {
          summary: "Compute a facility model (ledger and plant) or a heat-ledger input (ledger only), statelessly",
          requestBody: { required: true, content: { "application/json": { schema: { oneOf: [{ $ref: "#/components/schemas/FacilityModel" }, { $ref: "#/components/schemas/LedgerInput" }] } } } },
          responses: { "200": ok("Results with engine version and input hash"), "422": { description: "Physically impossible or non-converging result, naming the input" }, ...errors },
        },
      },
      "/api/v1/fluids": { get: { summary: "Refrigerants with metadata (safety group, GWP with source, critical point)", security: [], responses: { "200": ok("Fluid list") } } },
      "/api/v1/fluids/{id}/state": {
        get: {
          summary: "A state or saturation point (IIR reference state)",
          security: [],
          parameters: [{ name: "id", in: "path", required: true, schema: { type: "string" } }, { name: "query", in: "query", style: "form", explode: true, schema: { $ref: "#/components/schemas/StateQuery" } }],
          responses: { "200": ok("State"), ...errors },
        },
      },
      "/api/v1/fluids/{id}/chart": { get: { summary: "Pressure–enthalpy chart data", security: [], parameters: [{ name: "id", in: "path", required: true, schema: { type: "string" } }], responses: { "200": ok("Chart data") } } },
      "/api/v1/me": { get: { summary: "The signed-in person and their workspaces", responses: { "200": ok("Me") } }, patch: { summary: "Units (SI/IP) and theme", responses: { "200": ok("Updated") } } },
      "/api/v1/workspaces": { get: { summary: "My workspaces and roles", responses: { "200": ok("Workspaces") } } },
      "/api/v1/workspaces/{ws}/facilities": {
        get: { summary: "Facilities (archived=1 for archived)", parameters: [ws], responses: { "200": ok("Facilities"), ...errors } },
        post: { summary: "Create a facility (owner, designer)", parameters: [ws], requestBody: body("CreateFacility"), responses: { "201": ok("Created"), ...errors } },
      },
      "/api/v1/workspaces/{ws}/facilities/{id}": {
        get: { summary: "A facility", parameters: [ws, id], responses: { "200": ok("Facility"), ...errors } },
        patch: { summary: "Rename or change site conditions (owner, designer)", parameters: [ws, id], requestBody: body("UpdateFacility"), responses: { "200": ok("Updated"), "409": ok("Stale baseVersion"), ...errors } },
      },
      "/api/v1/workspaces/{ws}/facilities/{id}/duplicate": { post: { summary: "Duplicate (owner, designer)", parameters: [ws, id], requestBody: body("DuplicateFacility"), responses: { "201": ok("Copy"), ...errors } } },
      "/api/v1/workspaces/{ws}/facilities/{id}/archive": { post: { summary: "Archive or restore (owner, designer)", parameters: [ws, id], requestBody: body("ArchiveFacility"), responses: { "200": ok("Facility"), ...errors } } },
      "/api/v1/workspaces/{ws}/facilities/{id}/model": {
        get: { summary: "The model document and its version", parameters: [ws, id], responses: { "200": ok("Model"), ...errors } },
        put: { summary: "Save the model (owner, designer); non-overlapping concurrent edits are merged", parameters: [ws, id], requestBody: body("SaveModel"), responses: { "200": ok("Saved"), "409": ok("Overlapping concurrent edit: current document included"), ...errors } },
      },
      "/api/v1/workspaces/{ws}/settings": {
        get: { summary: "The workspace's settings (currency of running costs)", parameters: [ws], responses: { "200": ok("Settings"), ...errors } },
        patch: { summary: "Change the currency, an ISO 4217 code (owner)", parameters: [ws], requestBody: body("WorkspaceSettings"), responses: { "200": ok("Settings"), ...errors } },
      },
      "/api/v1/workspaces/{ws}/facilities/{id}/weather": {
        get: { summary: "The facility's weather year: source, year, monthly means, how it was read", parameters: [ws, id], responses: { "200": ok("Weather"), ...errors } },
        post: {
          summary: "Upload an hourly weather year (multipart field file: .csv or .epw, at most 4 MB, 8760 or 8784 hours; optional year). Any problem is refused naming its row and column; nothing is stored (owner, designer)",
          parameters: [ws, id],
          responses: { "201": ok("Stored, and the year queued"), ...errors },
        },
        put: { summary: "Build the weather from monthly means by the sine-day method, an approximation (owner, designer)", parameters: [ws, id], requestBody: body("MonthlyWeather"), responses: { "200": ok("Stored, and the year queued"), ...errors } },
      },
      "/api/v1/workspaces/{ws}/facilities/{id}/energy": {
        get: { summary: "The facility's year: the newest stored annual result with its stamps, why it is stale, a run in progress", parameters: [ws, id], responses: { "200": ok("Energy"), ...errors } },
        post: { summary: "Run the year on the worker (owner, designer); 202 with the job", parameters: [ws, id], responses: { "202": ok("Job"), ...errors } },
      },
      "/api/v1/workspaces/{ws}/facilities/{id}/results": { get: { summary: "Server results for the current version (engine version, input hash)", parameters: [ws, id], responses: { "200": ok("Results"), "422": ok("Calculation error"), ...errors } } },
      "/api/v1/workspaces/{ws}/facilities/{id}/revisions": { get: { summary: "Revision history", parameters: [ws, id], responses: { "200": ok("Revisions"), ...errors } } },
      "/api/v1/workspaces/{ws}/facilities/{id}/revisions/{n}/restore": { post: { summary: "Restore a revision as a new version (owner, designer)", parameters: [ws, id, { name: "n", in: "path", required: true, schema: { type: "integer" } }], responses: { "200": ok("Saved"), ...errors } } },
      "/api/v1/workspaces/{ws}/facilities/{id}/revisions/{n}/issue": { post: { summary: "Issue (and lock) a revision (owner, designer)", parameters: [ws, id, { name: "n", in: "path", required: true, schema: { type: "integer" } }], requestBody: body("IssueRevision"), responses: { "200": ok("Issued"), ...errors } } },
      "/api/v1/workspaces/{ws}/facilities/{id}/layout": {
        get: { summary: "Canvas node positions and viewport", parameters: [ws, id], responses: { "200": ok("Layout"), ...errors } },
        put: { summary: "Save positions and viewport (owner, designer); not an engineering revision", parameters: [ws, id], responses: { "200": ok("Saved"), ...errors } },
      },
      "/api/v1/workspaces/{ws}/facilities/{id}/layout/background": {
        get: { summary: "The site-plan image", parameters: [ws, id], responses: { "200": { description: "PNG or JPEG" }, ...errors } },
        put: { summary: "Upload a site plan (PNG/JPEG, at most 5 MB, checked by content; owner, designer)", parameters: [ws, id], responses: { "200": ok("Stored"), ...errors } },
        delete: { summary: "Remove the site plan (owner, designer)", parameters: [ws, id], responses: { "200": ok("Removed"), ...errors } },
      },
      "/api/v1/workspaces/{ws}/facilities/{id}/installed": {
        get: { summary: "The installed plant the stocking checks compare with", parameters: [ws, id], responses: { "200": ok("Installed plant"), ...errors } },
        put: { summary: "Record the installed plant as a new model version (owner, designer)", parameters: [ws, id], responses: { "200": ok("Saved"), ...errors } },
      },
      "/api/v1/workspaces/{ws}/facilities/{id}/scenarios": {
        get: { summary: "Stocking checks, with author and time", parameters: [ws, id], responses: { "200": ok("Scenarios"), ...errors } },
        post: { summary: "Run and save a stocking check (owner, designer, operations)", parameters: [ws, id], responses: { "201": ok("Scenario with verdict"), ...errors } },
      },
      "/api/v1/workspaces/{ws}/facilities/{id}/scenarios/{sid}": { get: { summary: "A stocking check", parameters: [ws, id, { name: "sid", in: "path", required: true, schema: { type: "string", format: "uuid" } }], responses: { "200": ok("Scenario"), ...errors } } },
      "/api/v1/workspaces/{ws}/facilities/{id}/scenarios/{sid}/email": { post: { summary: "E-mail a summary with a link (owner, designer, operations)", parameters: [ws, id, { name: "sid", in: "path", required: true, schema: { type: "string", format: "uuid" } }], responses: { "200": ok("Sent"), ...errors } } },
      "/api/v1/workspaces/{ws}/facilities/{id}/scenarios/{sid}/accept": { post: { summary: "Accept a stocking check (owner, designer)", parameters: [ws, id, { name: "sid", in: "path", required: true, schema: { type: "string", format: "uuid" } }], responses: { "200": ok("Accepted"), ...errors } } },
      "/api/v1/workspaces/{ws}/facilities/{id}/scenarios/{sid}/apply": { post: { summary: "Apply an accepted stocking check to the model as a new revision (owner, designer)", parameters: [ws, id, { name: "sid", in: "path", required: true, schema: { type: "string", format: "uuid" } }], responses: { "200": ok("Applied"), ...errors } } },
      "/api/v1/workspaces/{ws}/facilities/{id}/schedule": { get: { summary: "Equipment schedule with marks for what changed since the last export", parameters: [ws, id], responses: { "200": ok("Schedule"), ...errors } } },
      "/api/v1/workspaces/{ws}/facilities/{id}/exports": {
        post: {
          summary: "Start an export of the equipment schedule as a job (owner, designer, purchaser): .xlsx (schedule, room loads, circuits, state points, design basis) or .csv; recorded when made. The same person asking again for the same format while theirs is queued or running gets that job",
          parameters: [ws, id],
          requestBody: { required: true, content: { "application/json": { schema: { type: "object", required: ["format"], additionalProperties: false, properties: { format: { type: "string", enum: ["xlsx", "csv"] } } } } } },
          responses: { "202": ok("{ job, reused }: the job to poll (Location header)"), ...errors },
        },
      },
      "/api/v1/workspaces/{ws}/jobs/{jobId}": { get: { summary: "A job's status (queued, running, done, failed), progress 0–1, stage, error in words, and result; seen by the roles that may do its work", parameters: [ws, jobId], responses: { "200": ok("{ job }"), ...errors } } },
      "/api/v1/workspaces/{ws}/jobs/{jobId}/result": { get: { summary: "Download the file a finished job made (an export)", parameters: [ws, jobId], responses: { "200": { description: "The file (xlsx or csv)" }, "409": ok("Not finished, or failed (with the reason)"), ...errors } } },
      "/api/v1/workspaces/{ws}/facilities/{id}/import/rooms": { post: { summary: "Import a room list from XLSX/CSV: mode=preview answers the checked rows; mode=commit queues the all-or-nothing import as a job (owner, designer)", parameters: [ws, id], responses: { "200": ok("Preview"), "202": ok("{ job }: the commit, to poll"), ...errors } } },
      "/api/v1/workspaces/{ws}/facilities/{id}/import/stocking": { post: { summary: "Import a stocking plan from XLSX/CSV into one stocking check: mode=preview answers the checked rows; mode=commit queues it as a job (owner, designer, operations)", parameters: [ws, id], responses: { "200": ok("Preview"), "202": ok("{ job }: the commit, to poll"), ...errors } } },
      "/api/v1/workspaces/{ws}/members": { get: { summary: "Members (and, for owners, pending invites)", parameters: [ws], responses: { "200": ok("Members"), ...errors } } },
      "/api/v1/workspaces/{ws}/members/{userId}": {
        patch: { summary: "Change a role (owner); the last owner cannot be demoted", parameters: [ws, { name: "userId", in: "path", required: true, schema: { type: "string", format: "uuid" } }], requestBody: body("ChangeRole"), responses: { "200": ok("Changed"), "409": ok("Last owner"), ...errors } },
        delete: { summary: "Remove a member (owner); ends their sessions", parameters: [ws, { name: "userId", in: "path", required: true, schema: { type: "string", format: "uuid" } }], responses: { "200": ok("Removed"), "409": ok("Last owner"), ...errors } },
      },
      "/api/v1/workspaces/{ws}/invites": { post: { summary: "Invite by e-mail (owner)", parameters: [ws], requestBody: body("Invite"), responses: { "201": ok("Invited"), ...errors } } },
      "/api/v1/workspaces/{ws}/invites/{inviteId}": { delete: { summary: "Revoke a pending invitation (owner)", parameters: [ws, { name: "inviteId", in: "path", required: true, schema: { type: "string", format: "uuid" } }], responses: { "200": ok("Revoked"), ...errors } } },
      "/api/v1/workspaces/{ws}/audit": { get: { summary: "Audit log (owner)", parameters: [ws], responses: { "200": ok("Entries"), ...errors } } },
      "/api/v1/invites/accept": { post: { summary: "Accept an invitation", security: [], requestBody: body("AcceptInvite"), responses: { "200": ok("Joined"), ...errors } } },
      "/api/v1/auth/link": { post: { summary: "E-mail a one-time sign-in link", security: [], requestBody: body("EmailOnly"), responses: { "200": ok("Sent if the account exists") } } },
      "/api/v1/auth/reset-request": { post: { summary: "E-mail a password-reset link", security: [], requestBody: body("EmailOnly"), responses: { "200": ok("Sent if the account exists") } } },
      "/api/v1/auth/reset": { post: { summary: "Set a new password with a reset token; ends all sessions", security: [], requestBody: body("ResetPassword"), responses: { "200": ok("Changed"), ...errors } } },
    },
  };
}

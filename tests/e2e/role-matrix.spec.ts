import { test, expect, request as pwRequest, type APIRequestContext } from "@playwright/test";
import { emailOf, ROLES, stateOf, WS, type Role } from "./roles";
import { waitForMailLink } from "./mail";

/**
 * The role × action matrix over HTTP. The expectations are written out by hand from
 * PRODUCT.md's role descriptions — deliberately not derived from lib/authz.ts, which is what
 * this checks. A = allowed, D = denied (403).
 *
 *                       owner designer operations purchaser viewer
 *  list facilities        A      A        A          A        A
 *  read a facility        A      A        A          A        A
 *  create facility        A      A        D          D        D
 *  update facility        A      A        D          D        D
 *  duplicate facility     A      A        D          D        D
 *  archive facility       A      A        D          D        D
 *  list members           A      A        A          A        A
 *  invite                 A      D        D          D        D
 *  revoke an invitation   A      D        D          D        D
 *  change a role          A      D        D          D        D
 *  remove a member        A      D        D          D        D
 *  read the audit log     A      D        D          D        D
 *  start a schedule export A     A        D          A        D   (POST …/exports → 202, a job)
 *  read an export job     A      A        D          A        D   (GET …/jobs/[id])
 *  download its result    A      A        D          A        D   (GET …/jobs/[id]/result)
 */
type Cell = "A" | "D";
const M: Record<string, Record<Role, Cell>> = {
  listFacilities: { owner: "A", designer: "A", operations: "A", purchaser: "A", viewer: "A" },
  readFacility: { owner: "A", designer: "A", operations: "A", purchaser: "A", viewer: "A" },
  createFacility: { owner: "A", designer: "A", operations: "D", purchaser: "D", viewer: "D" },
  updateFacility: { owner: "A", designer: "A", operations: "D", purchaser: "D", viewer: "D" },
  duplicateFacility: { owner: "A", designer: "A", operations: "D", purchaser: "D", viewer: "D" },
  archiveFacility: { owner: "A", designer: "A", operations: "D", purchaser: "D", viewer: "D" },
  listMembers: { owner: "A", designer: "A", operations: "A", purchaser: "A", viewer: "A" },
  invite: { owner: "A", designer: "D", operations: "D", purchaser: "D", viewer: "D" },
  revokeInvite: { owner: "A", designer: "D", operations: "D", purchaser: "D", viewer: "D" },
  changeRole: { owner: "A", designer: "D", operations: "D", purchaser: "D", viewer: "D" },
  removeMember: { owner: "A", designer: "D", operations: "D", purchaser: "D", viewer: "D" },
  readAudit: { owner: "A", designer: "D", operations: "D", purchaser: "D", viewer: "D" },
  startExport: { owner: "A", designer: "A", operations: "D", purchaser: "A", viewer: "D" },
  readExportJob: { owner: "A", designer: "A", operations: "D", purchaser: "A", viewer: "D" },
  downloadExport: { owner: "A", designer: "A", operations: "D", purchaser: "A", viewer: "D" },
};

const site = { designDryBulbC: 30, coincidentWetBulbC: 21, groundTempC: 10, elevationM: 100 };
const base = `/api/v1/workspaces/${WS}`;
let ctx: Record<Role, APIRequestContext>;
let anon: APIRequestContext;
let facilityId: string;
let viewerId: string;

async function newMember(owner: APIRequestContext, tag: string): Promise<string> {
  const email = `tmp-${tag}-${Date.now()}@example.test`;
  expect((await owner.post(`${base}/invites`, { data: { email, role: "viewer" } })).status()).toBe(201);
  const link = await waitForMailLink(email, "invited you");
  const token = new URL(link).searchParams.get("token")!;
  const r = await anon.post("/api/v1/invites/accept", { data: { token, name: `Temp ${tag}`, password: "temporary-password-1" } });
  expect(r.status()).toBe(200);
  const members = await (await owner.get(`${base}/members`)).json();
  return members.members.find((m: { email: string }) => m.email === email).userId;
}

test.beforeAll(async ({ baseURL }) => {
  ctx = {} as Record<Role, APIRequestContext>;
  for (const r of ROLES) ctx[r] = await pwRequest.newContext({ baseURL, storageState: stateOf(r) });
  anon = await pwRequest.newContext({ baseURL });
  const list = await (await ctx.owner.get(`${base}/facilities`)).json();
  facilityId = list.facilities[0].id;
  const members = await (await ctx.owner.get(`${base}/members`)).json();
  viewerId = members.members.find((m: { email: string }) => m.email === emailOf("viewer")).userId;
});

test.afterAll(async () => {
  for (const r of ROLES) await ctx[r].dispose();
  await anon.dispose();
});

const ACTIONS: Record<keyof typeof M, (c: APIRequestContext, role: Role) => Promise<number>> = {
  listFacilities: async (c) => (await c.get(`${base}/facilities`)).status(),
  readFacility: async (c) => (await c.get(`${base}/facilities/${facilityId}`)).status(),
  createFacility: async (c, role) => (await c.post(`${base}/facilities`, { data: { name: `Matrix ${role}`, site } })).status(),
  updateFacility: async (c) => {
    const cur = await (await ctx.owner.get(`${base}/facilities/${facilityId}`)).json();
    return (await c.patch(`${base}/facilities/${facilityId}`, { data: { name: cur.facility.name } })).status();
  },
  duplicateFacility: async (c) => (await c.post(`${base}/facilities/${facilityId}/duplicate`, { data: {} })).status(),
  archiveFacility: async (c) => {
    const created = await (await ctx.designer.post(`${base}/facilities`, { data: { name: "To archive", site } })).json();
    return (await c.post(`${base}/facilities/${created.facility.id}/archive`, { data: { archived: true } })).status();
  },
  listMembers: async (c) => (await c.get(`${base}/members`)).status(),
  invite: async (c, role) => (await c.post(`${base}/invites`, { data: { email: `matrix-${role}-${Date.now()}@example.test`, role: "viewer" } })).status(),
  revokeInvite: async (c, role) => {
    const made = await (await ctx.owner.post(`${base}/invites`, { data: { email: `revoke-${role}-${Date.now()}@example.test`, role: "viewer" } })).json();
    return (await c.delete(`${base}/invites/${made.invite.id}`)).status();
  },
  changeRole: async (c) => (await c.patch(`${base}/members/${viewerId}`, { data: { role: "viewer" } })).status(),
  removeMember: async (c, role) => {
    const target = await newMember(ctx.owner, role);
    return (await c.delete(`${base}/members/${target}`)).status();
  },
  readAudit: async (c) => (await c.get(`${base}/audit`)).status(),
  startExport: async (c) => (await c.post(`${base}/facilities/${facilityId}/exports`, { data: { format: "csv" } })).status(),
  readExportJob: async (c) => (await c.get(`${base}/jobs/${(await ownerExport()).id}`)).status(),
  downloadExport: async (c) => (await c.get(`${base}/jobs/${(await ownerExport()).id}/result`)).status(),
};

/** One CSV export made by the owner and finished by the worker, shared by the job rows. */
let exportJob: Promise<{ id: string }> | null = null;
function ownerExport(): Promise<{ id: string }> {
  exportJob ??= (async () => {
    const r = await ctx.owner.post(`${base}/facilities/${facilityId}/exports`, { data: { format: "csv" } });
    expect(r.status()).toBe(202);
    const { job } = await r.json();
    await expect.poll(async () => (await (await ctx.owner.get(job.url)).json()).job.status, { timeout: 30_000 }).toBe("done");
    return { id: job.id as string };
  })();
  return exportJob;
}

for (const [action, row] of Object.entries(M)) {
  for (const role of ROLES) {
    test(`${action} as ${role} is ${row[role] === "A" ? "allowed" : "denied"}`, async () => {
      const status = await ACTIONS[action as keyof typeof M](ctx[role], role);
      if (row[role] === "A") expect(status, `${action} as ${role}`).toBeLessThan(300);
      else expect(status, `${action} as ${role}`).toBe(403);
    });
  }
  test(`${action} without signing in is 401`, async () => {
    const status = await ACTIONS[action as keyof typeof M](anon, "viewer");
    expect(status).toBe(401);
  });
}

test("a forbidden answer names the role and what is allowed", async () => {
  const r = await ctx.viewer.post(`${base}/facilities`, { data: { name: "No", site } });
  expect(r.status()).toBe(403);
  const body = await r.json();
  expect(body.error.code).toBe("forbidden");
  expect(body.error.message).toContain("viewer");
  expect(body.error.message).toContain("owner, designer");
});

test("a job is found only under its own workspace and by its id: a made-up id is 404, a malformed one 400", async () => {
  const r = await ctx.owner.get(`${base}/jobs/00000000-0000-4000-8000-000000000000`);
  expect(r.status()).toBe(404);
  expect((await r.json()).error.message).toBe("Job not found in this workspace.");
  const bad = await ctx.owner.get(`${base}/jobs/not-a-uuid`);
  expect(bad.status()).toBe(400);
  expect((await bad.json()).error.message).toMatch(/Job id must be a UUID/);
  expect((await ctx.owner.get(`/api/v1/workspaces/no-such-workspace/jobs/${(await ownerExport()).id}`)).status()).toBe(404);
});

test("a non-member cannot see that another workspace exists", async () => {
  const r = await ctx.viewer.get(`/api/v1/workspaces/no-such-workspace/facilities`);
  expect(r.status()).toBe(404);
});

test("the role is read from the database on each request: a demoted member loses the right at once, a removed one is signed out", async ({ baseURL }) => {
  const id = await newMember(ctx.owner, "demote");
  const members = await (await ctx.owner.get(`${base}/members`)).json();
  const email = members.members.find((m: { userId: string }) => m.userId === id).email;
  // make them a designer, sign them in, then demote: the next request must be refused
  expect((await ctx.owner.patch(`${base}/members/${id}`, { data: { role: "designer" } })).status()).toBe(200);
  const c = await pwRequest.newContext({ baseURL });
  const csrf = (await (await c.get("/api/auth/csrf")).json()).csrfToken;
  await c.post("/api/auth/callback/password", { form: { csrfToken: csrf, email, password: "temporary-password-1" } });
  expect((await c.post(`${base}/facilities`, { data: { name: "By temp designer", site } })).status()).toBe(201);
  expect((await ctx.owner.patch(`${base}/members/${id}`, { data: { role: "viewer" } })).status()).toBe(200);
  expect((await c.post(`${base}/facilities`, { data: { name: "Refused", site } })).status()).toBe(403);
  // removing them ends the session itself
  expect((await ctx.owner.delete(`${base}/members/${id}`)).status()).toBe(200);
  expect((await c.get("/api/v1/me")).status()).toBe(401);
  await c.dispose();
});

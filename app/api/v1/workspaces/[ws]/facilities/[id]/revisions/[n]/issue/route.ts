import { route } from "@/lib/api";
import { audit } from "@/lib/audit";
import { issueSchema, revisionParams } from "@/features/facilities/model-schema";
import { getFacilityRow } from "@/features/facilities/queries";
import { issueRevision } from "@/features/facilities/model";

export const POST = route({
  params: revisionParams,
  body: issueSchema,
  action: "revision.issue",
  handler: async ({ access, user, params, body }) => {
    const f = await getFacilityRow(access!.workspace.id, params.id);
    const r = await issueRevision(f.id, params.n, user.id, body);
    await audit({ workspaceId: access!.workspace.id, actorId: user.id, actorEmail: user.email, action: "revision.issued", targetType: "facility", targetId: f.id, detail: { number: params.n, ...body } });
    return { revision: { number: r.number, issuedLetter: r.issuedLetter, issuedStatus: r.issuedStatus, checkedBy: r.checkedBy, issuedAt: r.issuedAt?.toISOString() } };
  },
});

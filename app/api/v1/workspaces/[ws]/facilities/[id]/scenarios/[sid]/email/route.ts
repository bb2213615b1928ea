import { route } from "@/lib/api";
import { emailScenarioSchema, scenarioParams } from "@/features/stocking-check/schema";
import { emailScenario } from "@/features/stocking-check/queries";
import { takeMail } from "@/lib/throttle";

/** E-mails the check's summary with a link back to it (sharing is part of creating checks). */
export const POST = route({
  params: scenarioParams,
  action: "scenario.create",
  body: emailScenarioSchema,
  handler: async ({ access, user, params, body }) => {
    await takeMail(user.id, access!.workspace.id, body.to.length);
    return emailScenario({
      workspaceId: access!.workspace.id,
      workspaceSlug: access!.workspace.slug,
      facilityId: params.id,
      id: params.sid,
      sender: { name: user.name, email: user.email, unitSystem: user.unitSystem },
      to: body.to,
      note: body.note,
    });
  },
});

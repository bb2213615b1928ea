/** The roles of a workspace, in order of reach; the policy itself lives in lib/authz.ts. */
export const ROLE_NAMES = ["owner", "designer", "operations", "purchaser", "viewer"] as const;
export type RoleName = (typeof ROLE_NAMES)[number];

export const ROLE_SUMMARY: Record<RoleName, string> = {
  owner: "Invites people, sets roles, reads the audit log; everything a designer can do",
  designer: "Models facilities, sets site conditions, issues designs",
  operations: "Runs stocking checks against the installed plant",
  purchaser: "Reviews and exports the equipment schedule",
  viewer: "Reads everything, changes nothing",
};

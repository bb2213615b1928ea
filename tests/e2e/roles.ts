/** The demo accounts the seed creates (seeds/demo.ts), one per role. */
export const PASSWORD = "harrowfield-demo";
export const WS = "harrowfield";
export const ROLES = ["owner", "designer", "operations", "purchaser", "viewer"] as const;
export type Role = (typeof ROLES)[number];
export const emailOf = (r: Role) => `${r}@harrowfield.example`;
export const stateOf = (r: Role) => `tests/e2e/.auth/${r}.json`;

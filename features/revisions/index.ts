export { RevisionsPanel } from "./components/revisions-panel";
export type { RevisionRow } from "./schema";

export { reportQuery } from "./schema";
export type { ReportData } from "./queries";

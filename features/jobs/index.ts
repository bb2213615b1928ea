export type { JobDto, JobStatus } from "./schema";
export { isFinished } from "./schema";
export { JobProgress } from "./components/job-progress";

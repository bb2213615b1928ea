export type { ImportResultDto } from "./schema";

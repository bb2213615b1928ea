export type { ScheduleDto, ScheduleRowDto } from "./schema";
export { scheduleChanges, markText, type ChangeMark, type ScheduleChanges } from "./changes";
export { scheduleKindWord } from "./columns";
export { methodsAndSources, revisionLabel, SHEETS, type RevisionInfo } from "./workbook";

import type { ScheduleItem } from "@/lib/engine/plant/schedule";
import type { ChangeMark } from "./changes";
import type { RevisionInfo } from "./workbook";

export interface ScheduleRowDto extends ScheduleItem {
  roomName: string | null;
  circuitTag: string | null;
  mark: ChangeMark;
}

export interface ScheduleDto {
  facilityName: string;
  version: number;
  revision: RevisionInfo;
  rows: ScheduleRowDto[];
  /** Tags in the last export that are no longer in the schedule. */
  removed: string[];
  firstExport: boolean;
  lastExport: { at: string; by: string; revisionNumber: number; issued: boolean; kind: string } | null;
  warnings: string[];
}

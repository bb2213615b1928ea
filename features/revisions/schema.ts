export interface RevisionRow {
  number: number;
  summary: string | null;
  createdAt: string;
  author: string;
  issued: { letter: string; status: string; checkedBy: string; at: string; by: string } | null;
}

/** The issue statuses the API accepts (features/facilities/model-schema.ts). */
export const ISSUE_STATUSES = ["for comment", "for approval", "for tender", "for construction", "as built"] as const;

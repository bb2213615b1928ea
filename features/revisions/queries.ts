import "server-only";
import { desc, eq } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { db } from "@/db/client";
import { facilityRevisions, users } from "@/db/schema";
import type { RevisionRow } from "./schema";

/** The facility's revisions, newest first, with who saved and who issued them (the facility is checked by the caller). */
export async function revisionHistory(facilityId: string): Promise<RevisionRow[]> {
  const author = alias(users, "author");
  const issuer = alias(users, "issuer");
  const rows = await db
    .select({
      number: facilityRevisions.number,
      summary: facilityRevisions.summary,
      createdAt: facilityRevisions.createdAt,
      authorName: author.name,
      authorEmail: author.email,
      issuedLetter: facilityRevisions.issuedLetter,
      issuedStatus: facilityRevisions.issuedStatus,
      checkedBy: facilityRevisions.checkedBy,
      issuedAt: facilityRevisions.issuedAt,
      issuerName: issuer.name,
    })
    .from(facilityRevisions)
    .leftJoin(author, eq(author.id, facilityRevisions.createdBy))
    .leftJoin(issuer, eq(issuer.id, facilityRevisions.issuedBy))
    .where(eq(facilityRevisions.facilityId, facilityId))
    .orderBy(desc(facilityRevisions.number));
  return rows.map((r) => ({
    number: r.number,
    summary: r.summary,
    createdAt: r.createdAt.toISOString(),
    author: r.authorName ? `${r.authorName} (${r.authorEmail})` : "—",
    issued: r.issuedAt ? { letter: r.issuedLetter ?? "", status: r.issuedStatus ?? "", checkedBy: r.checkedBy ?? "", at: r.issuedAt.toISOString(), by: r.issuerName ?? "—" } : null,
  }));
}

import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { enqueue } from "@/lib/jobs/queue";
import type { JobContext, JobOutput } from "@/lib/jobs/worker";
import { getFacilityRow } from "@/features/facilities/queries";
import { importRooms, importStocking, type Upload } from "./queries";

type ImportKind = "rooms" | "stocking";

/** Queues the commit of an import ("import.rooms" / "import.stocking"); the file travels in the job row. */
export async function enqueueImport(args: { kind: ImportKind; workspaceId: string; facilityId: string; userId: string; upload: Upload }) {
  await getFacilityRow(args.workspaceId, args.facilityId); // not_found for another workspace's facility
  const { job } = await enqueue({
    kind: `import.${args.kind}`,
    workspaceId: args.workspaceId,
    facilityId: args.facilityId,
    createdBy: args.userId,
    input: { fileName: args.upload.fileName, name: args.upload.name },
    inputBytes: args.upload.buf,
    stage: `Waiting to import ${args.upload.fileName}`,
  });
  return job;
}

/**
 * The import jobs: read the file, check every row, and commit all rows or none (a file with
 * problems fails the job with the rows named, and nothing is changed). Authorization was
 * checked when the job was created; the model and scenario writes check the facility again.
 */
export function importJob(kind: ImportKind) {
  return async (ctx: JobContext): Promise<JobOutput> => {
    const { job } = ctx;
    if (!job.workspaceId || !job.facilityId || !job.createdBy || !job.inputBytes) throw new AppError("not_found", "The import has no file, facility or requester any more.");
    const [user] = await db.select({ id: users.id, email: users.email }).from(users).where(eq(users.id, job.createdBy)).limit(1);
    if (!user) throw new AppError("not_found", "The person who started this import no longer has an account.");
    const input = job.input as { fileName?: string; name?: string | null };
    const upload: Upload = { buf: job.inputBytes, fileName: input.fileName ?? "upload", mode: "commit", name: input.name ?? null };
    const run = kind === "rooms" ? importRooms : importStocking;
    const r = await run(job.workspaceId, job.facilityId, user, upload, ctx.progress);
    const what = r.committed?.version !== undefined ? `saved as model version ${r.committed.version}` : "saved as one stocking check";
    return { json: r as unknown as Record<string, unknown>, stage: `Imported ${r.itemCount} rows from ${r.fileName}: ${what}.` };
  };
}

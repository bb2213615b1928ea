"use client";

import { startTransition, useEffect, useState } from "react";
import { useRouter } from "next/navigation";
import { Button } from "@/components/ui/button";

type Cause = "checking" | "database" | "other";

/**
 * Shown when a page fails on the server. A production build hides the server's error message,
 * so the page asks the health route whether the database is away (the usual cause: a restart
 * or a failover) and says so; either way it tells the reader that saved work is kept and what
 * to do next.
 */
export default function AppError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  const router = useRouter();
  const [cause, setCause] = useState<Cause>("checking");

  useEffect(() => {
    let live = true;
    fetch("/api/v1/health", { cache: "no-store" })
      .then((r) => (live ? setCause(r.status === 503 ? "database" : "other") : undefined))
      .catch(() => live && setCause("database"));
    return () => {
      live = false;
    };
  }, [error]);

  const retry = () =>
    startTransition(() => {
      router.refresh();
      reset();
    });

  return (
    <main className="mx-auto max-w-xl p-8" role="alert" aria-live="assertive">
      {cause === "database" ? (
        <>
          <h1 className="text-lg font-semibold">The database is not reachable right now</h1>
          <p className="mt-2 text-sm">
            Rimeplan could not read this page because its database is away, usually for a restart that takes a minute. Nothing you saved is
            lost; a change you were making when this appeared may not have been saved.
          </p>
          <p className="mt-2 text-sm">Wait a minute and try again. If it keeps happening, tell whoever runs Rimeplan.</p>
        </>
      ) : (
        <>
          <h1 className="text-lg font-semibold">This page could not be shown</h1>
          <p className="mt-2 text-sm">
            {cause === "checking"
              ? "Something went wrong on the server while preparing this page."
              : "Something went wrong on the server while preparing this page; the database is answering, so this is a fault in Rimeplan."}{" "}
            Nothing you saved is lost. Try again; if it keeps happening, report it to whoever runs Rimeplan
            {error.digest ? (
              <>
                {" "}
                with the reference <code className="font-mono">{error.digest}</code>
              </>
            ) : null}
            .
          </p>
        </>
      )}
      <div className="mt-4 flex gap-2">
        <Button variant="primary" onClick={retry}>
          Try again
        </Button>
        <a className="inline-flex items-center px-3 py-1.5 text-sm text-accent underline" href="/">
          Go to your workspaces
        </a>
      </div>
    </main>
  );
}

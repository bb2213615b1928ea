import type { ReactNode } from "react";
import { Brand } from "@/components/layout/brand";
import { CodeNotice } from "@/components/layout/code-notice";

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col items-center justify-center gap-6 bg-surface-2 px-4 py-10">
      <Brand size={26} />
      <main className="w-full max-w-sm rounded-md border border-line bg-surface p-6 shadow-sm">{children}</main>
      <p className="max-w-sm text-center text-xs text-muted">
        Refrigeration planning for cold stores: heat loads, circuits and plant, stocking checks, equipment schedules.
      </p>
      <CodeNotice className="max-w-md text-center" />
    </div>
  );
}

import type { Verdict } from "@/lib/engine/stocking";
import { VERDICT_WORDS } from "../summary";

const STYLE: Record<Verdict, { icon: string; cls: string }> = {
  fits: { icon: "✓", cls: "text-ok border-ok/50 bg-ok/10" },
  tight: { icon: "▲", cls: "text-warn border-warn/50 bg-warn/10" },
  shortfall: { icon: "✕", cls: "text-danger border-danger/50 bg-danger/10" },
};

/** A verdict as word, icon and colour, so it reads in grayscale and for colour-blind users. */
export function VerdictBadge({ verdict, size = "sm" }: { verdict: Verdict; size?: "sm" | "lg" }) {
  const s = STYLE[verdict];
  return (
    <span
      data-verdict={verdict}
      className={`inline-flex items-center gap-1 rounded border font-semibold ${s.cls} ${size === "lg" ? "px-2.5 py-1 text-base" : "px-1.5 py-0.5 text-xs"}`}
    >
      <span aria-hidden="true">{s.icon}</span>
      {VERDICT_WORDS[verdict]}
    </span>
  );
}

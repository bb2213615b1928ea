"use client";
import { useState } from "react";
import { signOut } from "next-auth/react";
import Link from "next/link";

export function UserMenu({ name, email, unitSystem }: { name: string; email: string; unitSystem: "SI" | "IP"; theme: string }) {
  const [open, setOpen] = useState(false);
  return (
    <div className="relative">
      <button
        type="button"
        aria-haspopup="menu"
        aria-expanded={open}
        onClick={() => setOpen((o) => !o)}
        className="flex items-center gap-2 rounded px-2 py-1 text-sm hover:bg-surface-3"
      >
        <span className="font-medium">{name}</span>
        <span className="rounded bg-surface-3 px-1.5 py-0.5 font-mono text-[11px] text-muted">{unitSystem}</span>
      </button>
      {open ? (
        <div role="menu" className="absolute right-0 z-20 mt-1 w-56 rounded border border-line bg-surface p-1 shadow-lg">
          <p className="px-2 py-1 text-xs text-muted">{email}</p>
          <Link role="menuitem" href="/account" className="block rounded px-2 py-1.5 text-sm hover:bg-surface-3" onClick={() => setOpen(false)}>
            Units and theme
          </Link>
          <button
            role="menuitem"
            type="button"
            className="block w-full rounded px-2 py-1.5 text-left text-sm hover:bg-surface-3"
            onClick={() => signOut({ redirectTo: "/signin" })}
          >
            Sign out
          </button>
        </div>
      ) : null}
    </div>
  );
}

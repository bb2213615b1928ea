"use client";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { api } from "@/lib/api-client";

export function AccountForm(props: { name: string; unitSystem: "SI" | "IP"; theme: "system" | "light" | "dark" }) {
  const [unitSystem, setUnitSystem] = useState(props.unitSystem);
  const [theme, setTheme] = useState(props.theme);
  const [msg, setMsg] = useState<string | null>(null);
  async function save(e: React.FormEvent) {
    e.preventDefault();
    try {
      await api("/api/v1/me", { method: "PATCH", json: { unitSystem, theme } });
      setMsg("✓ Saved.");
      window.location.reload();
    } catch (err) {
      setMsg(`⚠ ${(err as Error).message}`);
    }
  }
  return (
    <main className="max-w-lg p-4">
      <h1 className="mb-3 text-base font-semibold">Units and theme</h1>
      <form onSubmit={save} className="flex flex-col gap-4">
        <fieldset className="flex flex-col gap-1">
          <legend className="text-xs font-medium text-muted">Unit system</legend>
          <label className="text-sm"><input type="radio" name="units" checked={unitSystem === "SI"} onChange={() => setUnitSystem("SI")} /> SI — °C, kW, bar, m</label>
          <label className="text-sm"><input type="radio" name="units" checked={unitSystem === "IP"} onChange={() => setUnitSystem("IP")} /> IP — °F, Btu/h and TR, psi, ft</label>
          <p className="text-xs text-muted">Values are stored in SI; this changes only how they are shown and typed.</p>
        </fieldset>
        <fieldset className="flex flex-col gap-1">
          <legend className="text-xs font-medium text-muted">Theme</legend>
          {(["system", "light", "dark"] as const).map((t) => (
            <label key={t} className="text-sm"><input type="radio" name="theme" checked={theme === t} onChange={() => setTheme(t)} /> {t}</label>
          ))}
        </fieldset>
        <div><Button type="submit" variant="primary">Save</Button></div>
        {msg ? <p role="status" className="text-sm">{msg}</p> : null}
      </form>
    </main>
  );
}

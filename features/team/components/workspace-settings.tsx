"use client";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { api, ApiError } from "@/lib/api-client";
import { COMMON_CURRENCIES } from "@/features/energy/schema";

/** The workspace's currency: the owner changes it; everyone else sees it. */
export function WorkspaceSettingsForm({ ws, initial, canEdit }: { ws: string; initial: { currency: string }; canEdit: boolean }) {
  const [currency, setCurrency] = useState(initial.currency);
  const [saved, setSaved] = useState(initial.currency);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const options = COMMON_CURRENCIES.includes(currency as (typeof COMMON_CURRENCIES)[number]) ? COMMON_CURRENCIES : [currency, ...COMMON_CURRENCIES];

  async function save(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setError(null);
    try {
      const r = await api<{ settings: { currency: string } }>(`/api/v1/workspaces/${ws}/settings`, { method: "PATCH", json: { currency } });
      setSaved(r.settings.currency);
      setCurrency(r.settings.currency);
    } catch (err) {
      setError(err instanceof ApiError ? err.message : "The change did not reach the server. Try again.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={save} className="flex max-w-xl flex-col gap-3 rounded border border-line bg-surface-2 p-4" aria-labelledby="ws-settings-h">
      <h2 id="ws-settings-h" className="text-base font-semibold">
        Workspace settings
      </h2>
      <div className="flex flex-col gap-1">
        <label htmlFor="ws-currency" className="text-xs font-medium text-muted">
          Currency of running costs (ISO 4217)
        </label>
        <select
          id="ws-currency"
          value={currency}
          disabled={!canEdit || busy}
          onChange={(e) => setCurrency(e.target.value)}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? "ws-currency-error" : "ws-currency-hint"}
          className="w-40 rounded border border-line bg-surface px-2 py-1.5 text-sm"
        >
          {options.map((c) => (
            <option key={c} value={c}>
              {c}
            </option>
          ))}
        </select>
        {error ? (
          <p id="ws-currency-error" role="alert" className="text-xs text-danger">
            ⚠ {error}
          </p>
        ) : (
          <p id="ws-currency-hint" className="text-xs text-muted">
            Electricity tariffs of every facility are entered, and annual costs shown, in this currency. Changing it converts nothing.
          </p>
        )}
      </div>
      {canEdit ? (
        <div className="flex items-center gap-3">
          <Button type="submit" variant="primary" disabled={busy || currency === saved}>
            {busy ? "Saving…" : "Save"}
          </Button>
          {currency === saved ? (
            <span role="status" className="text-xs text-muted">
              Currency: {saved}
            </span>
          ) : null}
        </div>
      ) : (
        <p className="text-xs text-muted">Only an owner changes the workspace&apos;s settings.</p>
      )}
    </form>
  );
}

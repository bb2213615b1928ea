"use client";
import { useEffect, useState } from "react";

/** Dispatched by the canvas autosave with `{ url, version }` when a new version is stored. */
export const FACILITY_VERSION_EVENT = "rimeplan:facility-version";

/** "version N" in the facility header, kept current when the canvas autosaves a new version. */
export function FacilityVersion({ facilityId, initial }: { facilityId: string; initial: number }) {
  const [version, setVersion] = useState(initial);
  useEffect(() => setVersion(initial), [initial]);
  useEffect(() => {
    const on = (e: Event) => {
      const d = (e as CustomEvent<{ url: string; version: number }>).detail;
      if (d?.url.includes(`/facilities/${facilityId}/`)) setVersion(d.version);
    };
    window.addEventListener(FACILITY_VERSION_EVENT, on);
    return () => window.removeEventListener(FACILITY_VERSION_EVENT, on);
  }, [facilityId]);
  return <span className="text-xs text-muted">version {version}</span>;
}

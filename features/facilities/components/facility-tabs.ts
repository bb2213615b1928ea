/**
 * The facility's views, in the order they show as tabs. A view is listed here only once it
 * works (UI.md: show a view only once it works).
 */
export const FACILITY_TABS: { slug: string; label: string }[] = [
  { slug: "layout", label: "Layout" },
  { slug: "ledger", label: "Heat ledger" },
  { slug: "circuits", label: "Circuits" },
  { slug: "stocking", label: "Stocking checks" },
  { slug: "schedule", label: "Equipment schedule" },
  { slug: "energy", label: "Energy" },
  { slug: "options", label: "Plant options" },
  { slug: "settings", label: "Site & settings" },
  { slug: "revisions", label: "Revisions" },
];

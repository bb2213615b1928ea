/** The Rimeplan mark: a frost crystal in a plan square. */
export function Brand({ size = 20 }: { size?: number }) {
  return (
    <span className="inline-flex items-center gap-2 font-semibold tracking-tight text-ink">
      <svg width={size} height={size} viewBox="0 0 24 24" aria-hidden="true" className="text-accent">
        <rect x="1.5" y="1.5" width="21" height="21" rx="3" fill="none" stroke="currentColor" strokeWidth="1.6" />
        <g stroke="currentColor" strokeWidth="1.6" strokeLinecap="round">
          <path d="M12 5v14M6 8.5l12 7M6 15.5l12-7" />
          <path d="M10.3 6.2 12 7.6l1.7-1.4M10.3 17.8 12 16.4l1.7 1.4" />
        </g>
      </svg>
      Rimeplan
    </span>
  );
}

/** The standing notice: Rimeplan plans; licensed practice and local codes decide. */
export function CodeNotice({ className = "" }: { className?: string }) {
  return (
    <p className={`text-xs text-muted ${className}`}>
      Rimeplan results are planning calculations. Every design must follow local codes and standards (EN 378, ISO 5149,
      ASHRAE 15, IIAR as locally adopted) and be checked by a licensed professional before it is built or changed.
    </p>
  );
}

/** The Sensewright mark: a shunt's four terminals with the sense pair drawn inside. */
export function Logo({ className = "h-5 w-5" }: { className?: string }) {
  return (
    <svg viewBox="0 0 24 24" className={className} aria-hidden="true">
      <rect x="3" y="9" width="18" height="6" rx="1" className="fill-copper" />
      <path d="M1 12h2M21 12h2" className="stroke-copper-strong" strokeWidth="2" />
      <path d="M8 9V4M16 9V4" className="stroke-signal" strokeWidth="2" strokeLinecap="round" />
    </svg>
  );
}

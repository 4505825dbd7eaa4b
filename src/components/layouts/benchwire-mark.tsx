/** Benchwire's mark: a ruled notebook page crossed by a trace, in the accent colour. */
export function BenchwireMark({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 20 20" aria-hidden="true" className={className} fill="none">
      <rect x="1.5" y="1.5" width="17" height="17" rx="1.5" className="stroke-copper" strokeWidth="1.6" />
      <path d="M5 6.5h10M5 10h10M5 13.5h10" className="stroke-copper/45" strokeWidth="1" />
      <path d="M4.5 14.5 8 8.5l3 3.5 4.5-7" className="stroke-copper" strokeWidth="1.8" strokeLinejoin="round" />
    </svg>
  );
}

/** Keelson's mark: a keel seen end-on under a waterline. */
export function KeelsonMark({ className = "h-6 w-6" }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true" focusable="false">
      <rect x="2" y="9" width="28" height="3" rx="1.5" className="fill-tide-500" />
      <path d="M6 14h20l-7 10h-6z" className="fill-brass-400" />
      <rect x="14.5" y="24" width="3" height="5" rx="1" className="fill-brass-500" />
    </svg>
  );
}

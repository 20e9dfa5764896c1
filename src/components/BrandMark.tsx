/** Loopwright's mark: two nested loops, as a stitch seen from the front. Decorative. */
export function BrandMark({ className = 'h-7 w-7' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true" focusable="false">
      <rect width="32" height="32" rx="7" className="fill-lavender-700" />
      <path
        d="M8 21c0-6 4-9.5 8-9.5s8 3.5 8 9.5M11.5 21c0-4 2-6.2 4.5-6.2s4.5 2.2 4.5 6.2"
        fill="none"
        className="stroke-samphire-200"
        strokeWidth="2.4"
        strokeLinecap="round"
      />
    </svg>
  );
}

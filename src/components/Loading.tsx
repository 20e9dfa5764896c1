/** A centred, announced loading state. `label` says what is loading. */
export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" className="flex flex-1 items-center justify-center gap-3 p-10 text-sm text-tide-600">
      <span className="h-4 w-4 animate-spin rounded-full border-2 border-lavender-200 border-t-lavender-600" aria-hidden="true" />
      {label}
    </div>
  );
}

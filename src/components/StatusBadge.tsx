/** A pattern's status as a small labelled badge (draft, in review, approved, released…). */
const tones: Record<string, string> = {
  draft: 'bg-tide-100 text-tide-800 border-tide-200',
  'in-review': 'bg-mudflat-50 text-mudflat-800 border-mudflat-200',
  review: 'bg-mudflat-50 text-mudflat-800 border-mudflat-200',
  'changes-requested': 'bg-glasswort-50 text-glasswort-800 border-glasswort-200',
  approved: 'bg-samphire-50 text-samphire-800 border-samphire-200',
  released: 'bg-lavender-100 text-lavender-800 border-lavender-200',
  published: 'bg-lavender-100 text-lavender-800 border-lavender-200',
};

/** Human wording of a status code: "in-review" → "In review". */
export function statusLabel(status: string): string {
  const words = status.replace(/[-_]+/g, ' ').trim();
  return words ? words[0].toUpperCase() + words.slice(1) : 'Unknown';
}

export function StatusBadge({ status }: { status: string }) {
  return (
    <span className={`inline-flex items-center rounded-full border px-2 py-0.5 text-caption font-medium ${tones[status] ?? tones.draft}`}>
      {statusLabel(status)}
    </span>
  );
}

/**
 * The strip at the top of the review, diff and knitting pages: back to the
 * pattern (or the library), the title with its status, and links between
 * the pattern's pages the person may use.
 */
import type { ReactNode } from 'react';
import { Link, NavLink } from 'react-router';
import { StatusBadge } from '../StatusBadge';

export interface PageHeaderProps {
  patternId: string;
  title: string;
  status: string;
  /** The person's role on the pattern; knitters see only the knitting page. */
  role: string | undefined;
  /** A line under the title (what this page shows). */
  subtitle?: ReactNode;
  /** Controls on the right. */
  children?: ReactNode;
}

const tab = ({ isActive }: { isActive: boolean }) =>
  `rounded-stitch px-2.5 py-1.5 text-sm font-medium ${isActive ? 'bg-lavender-100 text-lavender-800' : 'text-tide-700 hover:bg-tide-100 hover:text-tide-900'}`;

export function PageHeader({ patternId, title, status, role, subtitle, children }: PageHeaderProps) {
  const reviewer = role === 'owner' || role === 'editor';
  return (
    <div className="flex min-h-14 shrink-0 flex-wrap items-center gap-x-4 gap-y-2 border-b border-tide-200 bg-white px-4 py-2">
      <Link to="/patterns" className="shrink-0 whitespace-nowrap rounded-stitch px-1.5 py-1 text-sm text-tide-700 hover:bg-tide-100 hover:text-tide-900">
        <span aria-hidden="true">←</span> Patterns
      </Link>
      <div className="min-w-0 flex-1">
        <div className="flex items-center gap-2">
          <h1 className="truncate text-base font-semibold text-tide-900">{title || 'Untitled pattern'}</h1>
          <StatusBadge status={status} />
        </div>
        {subtitle && <p className="truncate text-caption text-tide-600">{subtitle}</p>}
      </div>
      <nav aria-label="Pattern pages" className="flex items-center gap-1">
        {reviewer && <NavLink to={`/patterns/${patternId}`} end className={tab}>Studio</NavLink>}
        {reviewer && <NavLink to={`/patterns/${patternId}/review`} className={tab}>Review</NavLink>}
        <NavLink to={`/patterns/${patternId}/knit`} className={tab}>Knit</NavLink>
      </nav>
      {children}
    </div>
  );
}

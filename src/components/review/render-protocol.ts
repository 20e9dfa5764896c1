/**
 * Messages between the review and knitting pages and their render worker
 * (render.worker.ts): compile a saved revision's source once, then draw the
 * chart (front) and write the instructions of one size. Only what the pages
 * show crosses the thread boundary.
 */
import type { Instructions } from '../../../shared/render/instructions';

/** Page → worker: draw `size` (null: the first) of `source`. `id` increases per request. */
export interface RenderRequest {
  id: number;
  source: string;
  size: string | null;
  /** Chart cell size in px. */
  cell: number;
  /** Whether to write the instructions too (the diff page needs only the chart). */
  instructions: boolean;
}

/** Counts of one round as the pages show them. */
export interface RenderedRound { number: number; side: 'RS' | 'WS'; front: number; backing: number; total: number }

/** Worker → page: the drawing of request `id`. */
export interface RenderAnswer {
  id: number;
  sizes: string[];
  size: string;
  construction: 'round' | 'flat';
  rounds: RenderedRound[];
  /** The front chart as an SVG document (text escaped by the renderer), or null with `problem`. */
  svg: string | null;
  instructions: Instructions | null;
  /** Why something is missing, in plain words. */
  problem?: string;
}

export type { Instructions };

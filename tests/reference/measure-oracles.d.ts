// Type declarations for the general-purpose oracle libraries used by the
// measurement reference tests (these packages ship JavaScript without types).

declare module 'color-diff' {
  export interface LabColor { L: number; a: number; b: number }
  export interface RgbColor { R: number; G: number; B: number; A?: number }
  /** CIEDE2000 difference of two CIELAB colours. */
  export function diff(c1: LabColor, c2: LabColor): number;
  /** sRGB (0-255) to CIELAB (D65). */
  export function rgbaToLab(c: RgbColor): LabColor;
}

declare module 'wcag-contrast' {
  /** WCAG contrast ratio of two hex colours. */
  export function hex(a: string, b: string): number;
  /** WCAG contrast ratio of two [r, g, b] triplets (0-255). */
  export function rgb(a: [number, number, number], b: [number, number, number]): number;
  /** Contrast ratio from two relative luminances. */
  export function luminance(a: number, b: number): number;
}

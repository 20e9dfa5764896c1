/**
 * The browser's culori: the same functions from culori's tree-shakeable
 * entry (`culori/fn`) with only the colour spaces a pattern needs
 * registered (sRGB with hex and CSS names, linear RGB for contrast and the
 * colour-vision filters, CIELAB D65 for CIEDE2000, which converts from sRGB
 * directly; sources write colours as #rrggbb or CSS names, so no other
 * notation is needed).
 * vite.config.ts points `culori` here for the client build, so the compile
 * worker does not carry every colour space culori knows; the server and the
 * command line use the full package. Behaviour on these spaces is culori's
 * own (the same code), checked in the browser tests (tests/e2e/studio.test.ts compares the
 * browser's diagnostics, colour differences included, with the server's).
 */
import { modeLab65, modeLrgb, modeRgb, useMode } from 'culori/fn';

useMode(modeRgb);
useMode(modeLrgb);
useMode(modeLab65);

export * from 'culori/fn';

/**
 * Loopwright's design tokens, read by Tailwind CSS 4 through the `@config`
 * directive in src/styles/app.css.
 *
 * The palette is drawn from a salt marsh at low tide: sea-lavender (the brand
 * and focus colour), samphire (success, "counts add up"), tide grey (text,
 * lines, surfaces), mudflat ochre (warnings) and glasswort red (errors; the
 * plant turns red in autumn). Every text pairing used in the UI keeps WCAG AA
 * contrast (4.5:1 for body text): on white, `tide-600` and darker, `lavender-600`
 * and darker, `samphire-700` and darker, `mudflat-700`+ and `glasswort-600`+.
 *
 * The whole colour scale is replaced (not extended) so nothing drifts back to
 * framework defaults; spacing and type add named tokens for the studio layout.
 */
import type { Config } from 'tailwindcss';

const config: Config = {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    colors: {
      transparent: 'transparent',
      current: 'currentColor',
      white: '#ffffff',
      black: '#0e1112',
      foam: '#fbfbf7',
      lavender: {
        50: '#f6f4fa', 100: '#ece7f5', 200: '#d8cfeb', 300: '#bcaedb', 400: '#9d88c7',
        500: '#8069b1', 600: '#6a5397', 700: '#56437b', 800: '#42345e', 900: '#2d2441',
      },
      samphire: {
        50: '#f2f7ec', 100: '#e2eed4', 200: '#c6dcaa', 300: '#a4c67a', 400: '#82ac52',
        500: '#668f38', 600: '#50722c', 700: '#3e5a23', 800: '#2f441b', 900: '#202e13',
      },
      tide: {
        50: '#f4f6f7', 100: '#e7ebed', 200: '#d1d8dc', 300: '#b0bbc1', 400: '#8a979f',
        500: '#6b7a83', 600: '#56636b', 700: '#434e55', 800: '#30393e', 900: '#1f2629', 950: '#151a1c',
      },
      mudflat: {
        50: '#fbf6e9', 100: '#f5e8c6', 200: '#ecd394', 300: '#e0ba62', 400: '#cc9c36',
        500: '#ad7f1f', 600: '#8c6517', 700: '#6d4e13', 800: '#533b10', 900: '#3a290b',
      },
      glasswort: {
        50: '#fbefee', 100: '#f6dad8', 200: '#ecb5b1', 300: '#df8a85', 400: '#cd605a',
        500: '#b8443e', 600: '#9d3430', 700: '#7f2a27', 800: '#612120', 900: '#431817',
      },
    },
    fontFamily: {
      sans: ['"Inter"', 'system-ui', 'sans-serif'],
      mono: ['"JetBrains Mono"', 'ui-monospace', 'monospace'],
    },
    extend: {
      spacing: {
        // Height of the studio's top bar; the workspace fills the rest.
        bar: '3.25rem',
        // Minimum width of the right-hand view panes (fits three sizes of counts).
        pane: '26rem',
        // Width of narrow forms (sign in, reset).
        form: '24rem',
      },
      fontSize: {
        // Dense tabular figures in the counts pane and problem list.
        tally: ['0.8125rem', { lineHeight: '1.25rem' }],
        caption: ['0.75rem', { lineHeight: '1rem' }],
        title: ['1.375rem', { lineHeight: '1.875rem', fontWeight: '600' }],
      },
      borderRadius: {
        stitch: '0.3125rem',
      },
      boxShadow: {
        float: '0 8px 24px -6px rgb(31 38 41 / 0.22), 0 2px 6px -2px rgb(31 38 41 / 0.12)',
      },
    },
  },
};

export default config;

// Plumbline's design tokens: the palette, semantic colour roles for light and dark, the speed ramp,
// phase colours, type, spacing and radii. Components use these names, never raw colour values.
import type { Config } from "tailwindcss";
import plugin from "tailwindcss/plugin";

/** Raw palette. Only this file names colour values; everything else goes through the roles below. */
export const palette = {
  // Warm off-white, like a chalked platform.
  chalk: { 50: "#fcfbf8", 100: "#f7f5f0", 200: "#eeebe3", 300: "#e0dbcf", 400: "#c8c1b1" },
  // Warm near-black greys.
  iron: {
    100: "#e5e4e0",
    200: "#cac9c4",
    300: "#aaa9a4",
    400: "#898984",
    500: "#6c6c68",
    600: "#545451",
    700: "#3f3f3d",
    800: "#2c2c2a",
    900: "#1e1e1d",
    950: "#141413",
  },
  // The one action colour, and the speed ramp.
  teal: {
    50: "#ebf6f4",
    100: "#cfebe6",
    200: "#a1d7ce",
    300: "#6cbdb1",
    400: "#3ba093",
    500: "#1d8476",
    600: "#126b60",
    700: "#0e564e",
    800: "#0c443e",
    900: "#0a3531",
    950: "#05211e",
  },
  // Warnings only.
  amber: { 50: "#fdf6e4", 100: "#f9e7bd", 300: "#eec061", 500: "#d4900f", 700: "#8a5a08", 900: "#4a3006", 950: "#2b1c04" },
  // Faults only.
  brick: { 50: "#fbeeea", 100: "#f4d4cc", 300: "#dd907f", 500: "#b5452f", 700: "#7c2c1e", 900: "#431710", 950: "#2a0e09" },
  // Eccentric phase.
  slate: { 100: "#d9e1eb", 300: "#9bafc8", 400: "#7991b3", 500: "#5b759b", 600: "#485e80", 700: "#394b67" },
} as const;

const { chalk, iron, teal, amber, brick, slate } = palette;

/** Semantic roles as [light, dark]. Each becomes a CSS variable `--pl-<role>` and a colour `<role>`. */
const roles = {
  canvas: [chalk[100], iron[950]],
  surface: [chalk[50], iron[900]],
  sunken: [chalk[200], iron[800]],
  line: [chalk[300], iron[700]],
  "line-strong": [chalk[400], iron[600]],
  ink: [iron[900], chalk[100]],
  "ink-muted": [iron[600], iron[300]],
  "ink-faint": [iron[500], iron[400]],
  action: [teal[700], teal[300]],
  "action-hover": [teal[800], teal[200]],
  "on-action": [chalk[50], iron[950]],
  "action-soft": [teal[50], teal[950]],
  focus: [teal[500], teal[300]],
  caution: [amber[700], amber[300]],
  "caution-soft": [amber[50], amber[950]],
  "caution-line": [amber[300], amber[700]],
  fault: [brick[500], brick[300]],
  "fault-soft": [brick[50], brick[950]],
  "fault-line": [brick[300], brick[700]],
  "phase-eccentric": [slate[500], slate[400]],
  "phase-concentric": [teal[500], teal[400]],
  "phase-pause": [iron[400], iron[500]],
} as const satisfies Record<string, readonly [string, string]>;

/**
 * Bar speed as one teal ramp, step 1 = slowest. In light mode faster is darker; in dark mode faster is
 * lighter, so a faster rep always stands out more from the background.
 */
const speedSteps = [teal[100], teal[200], teal[300], teal[400], teal[500], teal[600], teal[700], teal[800]] as const;

const speedRoles = Object.fromEntries(
  speedSteps.map((light, i) => [`speed-${i + 1}`, [light, speedSteps[speedSteps.length - 1 - i]] as const]),
) as Record<string, readonly [string, string]>;

const allRoles: Record<string, readonly [string, string]> = { ...roles, ...speedRoles };

function cssVariables(pick: 0 | 1): Record<string, string> {
  return Object.fromEntries(Object.entries(allRoles).map(([name, pair]) => [`--pl-${name}`, pair[pick]]));
}

const roleColours = Object.fromEntries(Object.keys(allRoles).map((name) => [name, `var(--pl-${name})`]));

/** Number of steps on the speed ramp, for code that maps a velocity onto `bg-speed-<n>`. */
export const SPEED_STEPS = speedSteps.length;

const config = {
  darkMode: "media",
  theme: {
    extend: {
      colors: { ...palette, ...roleColours },
      fontFamily: {
        sans: ["var(--font-inter)", "var(--font-inter-ext)", "ui-sans-serif", "system-ui", "sans-serif"],
      },
      fontSize: {
        // Dense data-first scale: 13 px is the table and label size.
        "2xs": ["0.6875rem", { lineHeight: "1rem" }],
        xs: ["0.75rem", { lineHeight: "1rem" }],
        sm: ["0.8125rem", { lineHeight: "1.25rem" }],
      },
      spacing: {
        // Minimum touch target for athletes on a phone (WCAG 2.5.5 target size: 44 CSS px; we round up).
        touch: "3rem",
        gutter: "1rem",
        "gutter-wide": "1.5rem",
        measure: "40rem",
      },
      borderRadius: {
        sm: "0.1875rem",
        DEFAULT: "0.375rem",
        md: "0.375rem",
        lg: "0.625rem",
      },
      maxWidth: { page: "72rem", form: "28rem", prose: "40rem" },
    },
  },
  plugins: [
    plugin(({ addBase }) => {
      addBase({
        ":root": { ...cssVariables(0), "color-scheme": "light" },
        "@media (prefers-color-scheme: dark)": { ":root": { ...cssVariables(1), "color-scheme": "dark" } },
      });
    }),
  ],
} satisfies Config;

export default config;

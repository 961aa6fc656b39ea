import type { Config } from "tailwindcss";

/**
 * Loopkeeper's own theme: warm graphite neutrals, a copper accent (the colour of radiator
 * fins), a coolant blue for pump traces, and plain signal colours for state. Every text
 * pairing used in the app meets WCAG AA (4.5:1) on its background.
 */
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        ink: {
          50: "#f7f6f3",
          100: "#edebe6",
          200: "#dbd8d0",
          300: "#bfbbb0",
          400: "#8f8a7e",
          500: "#68635a",
          600: "#524e46",
          700: "#3e3b35",
          800: "#2a2824",
          900: "#1c1b18",
          950: "#121110",
        },
        copper: {
          50: "#fbf4ef",
          100: "#f5e2d4",
          200: "#eac1a4",
          300: "#dc9b71",
          400: "#cd7b4b",
          500: "#b5612f",
          600: "#974e25",
          700: "#7a3f1f",
          800: "#5d301a",
          900: "#412214",
        },
        coolant: {
          50: "#eef6f9",
          100: "#d8eaf2",
          300: "#8cbfd6",
          500: "#2f7195",
          600: "#255b79",
          700: "#1c465d",
        },
        signal: {
          ok: "#276b43",
          okBg: "#e3f2e8",
          warn: "#8a5700",
          warnBg: "#fbf0d9",
          fault: "#a3211a",
          faultBg: "#fbe5e3",
        },
      },
      fontFamily: {
        sans: ["var(--font-sans)", "ui-sans-serif", "system-ui", "sans-serif"],
        mono: ["ui-monospace", "SFMono-Regular", "Menlo", "Consolas", "monospace"],
      },
      fontSize: {
        xs: ["0.75rem", { lineHeight: "1rem" }],
        sm: ["0.8125rem", { lineHeight: "1.125rem" }],
        base: ["0.875rem", { lineHeight: "1.25rem" }],
        lg: ["1rem", { lineHeight: "1.375rem" }],
        xl: ["1.1875rem", { lineHeight: "1.625rem" }],
        "2xl": ["1.4375rem", { lineHeight: "1.875rem" }],
        "3xl": ["1.75rem", { lineHeight: "2.125rem" }],
      },
      borderRadius: { DEFAULT: "3px", md: "4px", lg: "6px" },
      boxShadow: { panel: "0 1px 0 rgba(28,27,24,0.06), 0 0 0 1px rgba(28,27,24,0.08)" },
    },
  },
};

export default config;

import type { Config } from "tailwindcss";

/**
 * Colours are CSS variables set per theme in app/globals.css (light, dark, outdoor),
 * so one class name reads well in every scheme. Meaning is never carried by colour alone.
 */
const v = (name: string) => `rgb(var(--${name}) / <alpha-value>)`;

const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        surface: v("surface"),
        raised: v("raised"),
        ink: v("ink"),
        muted: v("muted"),
        line: v("line"),
        accent: v("accent"),
        "accent-ink": v("accent-ink"),
        air: v("air"),
        ground: v("ground"),
        warn: v("warn"),
        danger: v("danger"),
        good: v("good"),
      },
      fontFamily: { sans: ["var(--font-inter)", "system-ui", "sans-serif"] },
      minHeight: { touch: "4rem" },
      minWidth: { touch: "4rem" },
    },
  },
};

export default config;

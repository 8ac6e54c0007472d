/**
 * Sets the saved theme before the first paint, so the page never flashes the wrong scheme.
 * Outdoor (high contrast) is the default: the app is used in the sun.
 */
export const THEME_KEY = "windowcall.theme";
export const THEMES = ["outdoor", "light", "dark"] as const;
export type Theme = (typeof THEMES)[number];

const script = `try{var t=localStorage.getItem(${JSON.stringify(THEME_KEY)});if(["outdoor","light","dark"].indexOf(t)<0)t="outdoor";document.documentElement.dataset.theme=t}catch(e){document.documentElement.dataset.theme="outdoor"}`;

export function ThemeScript() {
  return <script dangerouslySetInnerHTML={{ __html: script }} />;
}

/**
 * Sets the saved theme before the first paint, so the page never flashes the wrong scheme.
 * Outdoor (high contrast) is the default: the app is used in the sun. Also marks whether this
 * phone has read the first-use cautions (`data-cautions-seen`), so the field page can render
 * them on the server and hide them before paint, with nothing moving once the page hydrates.
 */
export const THEME_KEY = "windowcall.theme";
export const THEMES = ["outdoor", "light", "dark"] as const;
export type Theme = (typeof THEMES)[number];
export const CAUTIONS_SEEN_KEY = "windowcall.cautions.seen";

const script = `try{var t=localStorage.getItem(${JSON.stringify(THEME_KEY)});if(["outdoor","light","dark"].indexOf(t)<0)t="outdoor";document.documentElement.dataset.theme=t}catch(e){document.documentElement.dataset.theme="outdoor"}try{if(localStorage.getItem(${JSON.stringify(CAUTIONS_SEEN_KEY)})==="1")document.documentElement.dataset.cautionsSeen="1"}catch(e){}`;

/** The inline script, carrying this response's CSP nonce (browsers hide it from the DOM, hence the warning opt-out). */
export function ThemeScript({ nonce }: { nonce?: string }) {
  return <script nonce={nonce} suppressHydrationWarning dangerouslySetInnerHTML={{ __html: script }} />;
}

/** The scheme now on the page. */
export function readTheme(): Theme {
  const t = document.documentElement.dataset.theme as Theme | undefined;
  return t && THEMES.includes(t) ? t : "outdoor";
}

/** Applies a scheme and remembers it on this device. */
export function applyTheme(next: Theme): void {
  document.documentElement.dataset.theme = next;
  try {
    localStorage.setItem(THEME_KEY, next);
  } catch {
    /* private mode: the choice lasts for this page only */
  }
}

/** Calls back whenever the scheme changes. */
export function subscribeTheme(onChange: () => void): () => void {
  const observer = new MutationObserver(onChange);
  observer.observe(document.documentElement, { attributes: true, attributeFilter: ["data-theme"] });
  return () => observer.disconnect();
}

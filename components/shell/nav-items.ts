/**
 * The app's main screens, in the order of the bottom bar: six, so each keeps a 60 px target on a
 * 360 px phone. Settings is in the top bar (SETTINGS_ICON); other screens are reached from these.
 */
export const NAV_ITEMS = [
  { href: "/", label: "Home", icon: "M4 11l8-7 8 7v9h-5v-6H9v6H4z" },
  { href: "/field", label: "Field", icon: "M12 3v9l5 3M12 21a9 9 0 1 0 0-18 9 9 0 0 0 0 18z" },
  { href: "/logbook", label: "Logbook", icon: "M5 4h11a3 3 0 0 1 3 3v13H8a3 3 0 0 1-3-3z" },
  { href: "/hangar", label: "Hangar", icon: "M3 11l9-6 9 6v9H3zM8 20v-5h8v5" },
  { href: "/clubs", label: "Clubs", icon: "M9 11a3 3 0 1 0 0-6 3 3 0 0 0 0 6zM3 20a6 6 0 0 1 12 0M17 11a2.5 2.5 0 1 0 0-5M21 19a5 5 0 0 0-4-4.9" },
  { href: "/season", label: "Season", icon: "M5 20v-8m7 8V5m7 15v-5M3 20h18" },
] as const;

/** The top bar's link to Settings (a gear). */
export const SETTINGS_ICON = "M12 15a3 3 0 1 0 0-6 3 3 0 0 0 0 6zM4 12h2m12 0h2M12 4v2m0 12v2";

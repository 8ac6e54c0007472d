/** The app's main screens, in the order of the bottom bar. */
export const NAV_ITEMS = [
  { href: "/field", label: "Field", icon: "M12 3v9l5 3" },
  { href: "/logbook", label: "Logbook", icon: "M5 4h11a3 3 0 0 1 3 3v13H8a3 3 0 0 1-3-3z" },
  { href: "/season", label: "Season", icon: "M4 19l5-6 4 3 7-9" },
  { href: "/club", label: "Club", icon: "M8 11a3 3 0 1 0 0-6 3 3 0 0 0 0 6zm8 0a3 3 0 1 0 0-6M2 20c0-3 3-5 6-5s6 2 6 5m2-5c3 0 6 2 6 5" },
  { href: "/settings", label: "Settings", icon: "M12 15a3 3 0 1 0 0-6 3 3 0 0 0 0 6zM4 12h2m12 0h2M12 4v2m0 12v2" },
] as const;

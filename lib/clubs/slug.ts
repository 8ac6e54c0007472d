/**
 * A club's address name from its name: lower-case ASCII letters and digits joined by single
 * hyphens ("Heronmoor Hand-Launch Club" → "heronmoor-hand-launch-club"), accents dropped, at most
 * 48 characters; "club" when nothing is left. `n` > 1 adds "-n" for the n-th club of that name.
 */
export function clubSlug(name: string, n = 1): string {
  const base =
    name
      .normalize("NFKD")
      .replace(/[\u0300-\u036f]/g, "")
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, "-")
      .replace(/^-+|-+$/g, "")
      .slice(0, 48)
      .replace(/-+$/, "") || "club";
  return n > 1 ? `${base}-${n}` : base;
}

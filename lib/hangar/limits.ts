/**
 * The class limits of a discus-launch glider: span at most 1500 mm and mass at most 600 g
 * (FAI Sporting Code F3K.2.1; see /work/shared/PRODUCT.md and RULES.md's source). The hangar shows a
 * caution when a model is over them — it may still be flown in practice, so nothing is blocked.
 */
export const CLASS_LIMITS = { spanMm: 1500, massG: 600 } as const;

export function classCautions(model: { spanMm: number; massG: number }): string[] {
  const out: string[] = [];
  if (model.spanMm > CLASS_LIMITS.spanMm) out.push(`Span ${model.spanMm} mm is over the class limit of ${CLASS_LIMITS.spanMm} mm (F3K.2.1): not eligible for contests.`);
  if (model.massG > CLASS_LIMITS.massG) out.push(`Mass ${model.massG} g is over the class limit of ${CLASS_LIMITS.massG} g (F3K.2.1): not eligible for contests.`);
  return out;
}

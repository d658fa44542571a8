/**
 * A refrigerant charge in the shop's working units: pounds and ounces first, kilograms beside.
 * 1 lb = 0.45359237 kg exactly (international avoirdupois pound; NIST SP 811, appendix B.8);
 * 1 lb = 16 oz. Ounces are rounded to the nearest whole ounce, carried into pounds at 16.
 */
export const KG_PER_POUND = 0.45359237;

export function chargeWords(kg: number): string {
  const totalOz = Math.round((kg / KG_PER_POUND) * 16);
  const lb = Math.floor(totalOz / 16);
  const oz = totalOz - lb * 16;
  const imperial = lb === 0 ? `${oz} oz` : oz === 0 ? `${lb} lb` : `${lb} lb ${oz} oz`;
  return `${imperial} (${Number(kg.toFixed(2))} kg)`;
}

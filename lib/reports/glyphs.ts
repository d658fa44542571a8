/**
 * Text the PDF's embedded font can print. The report PDF embeds IBM Plex Sans from
 * @fontsource/ibm-plex-sans (its latin subset, shipped with the app); a character the font does
 * not have would print as an empty box, so the few the product writes that it lacks (→, ≤, ✓, …)
 * are written in words or ASCII instead, and anything else outside the font becomes "?".
 */

/** The latin subset's unicode-range, as @fontsource declares it (checked against the font in tests). */
export const PDF_FONT_RANGES: readonly [number, number][] = [
  [0x0000, 0x00ff], [0x0131, 0x0131], [0x0152, 0x0153], [0x02bb, 0x02bc], [0x02c6, 0x02c6], [0x02da, 0x02da], [0x02dc, 0x02dc],
  [0x0304, 0x0304], [0x0308, 0x0308], [0x0329, 0x0329], [0x2000, 0x206f], [0x20ac, 0x20ac], [0x2122, 0x2122], [0x2191, 0x2191],
  [0x2193, 0x2193], [0x2212, 0x2212], [0x2215, 0x2215], [0xfeff, 0xfeff], [0xfffd, 0xfffd],
];

const SUBSTITUTES: Record<string, string> = {
  "→": " to ",
  "←": " from ",
  "≤": "<=",
  "≥": ">=",
  "≈": "about ",
  "✓": "",
  "✕": "",
  "✗": "",
  "⁻": "-",
  "⁰": "0", "¹": "1", "⁴": "4", "⁵": "5", "⁶": "6", "⁷": "7", "⁸": "8", "⁹": "9",
  "\u202f": " ", // narrow no-break space that dates in some locales carry
};

export function inPdfFont(codePoint: number): boolean {
  return PDF_FONT_RANGES.some(([lo, hi]) => codePoint >= lo && codePoint <= hi);
}

/** The text with every character the font lacks replaced (see SUBSTITUTES), control characters but newline removed. */
export function pdfText(text: string): string {
  let out = "";
  for (const ch of text) {
    const cp = ch.codePointAt(0)!;
    if (SUBSTITUTES[ch] !== undefined) out += SUBSTITUTES[ch];
    else if (cp === 0x0a || (cp >= 0x20 && inPdfFont(cp) && !(cp >= 0x7f && cp < 0xa0))) out += ch;
    else if (cp < 0x20) out += " ";
    else out += "?";
  }
  return out.replace(/ {2,}/g, " ");
}

/**
 * Codes shown as words: a stored code such as `heat_pump` or `split_ac` is never put on a screen
 * as it is. Known codes have their own words; any other snake_case code becomes a sentence-case
 * phrase ("walk_in_cooler" → "Walk in cooler"); text that is not a code is returned unchanged.
 */
const KNOWN: Record<string, string> = {
  heat_pump: "Heat pump",
  split_ac: "Split air conditioner",
  mini_split: "Ductless mini-split",
  packaged_unit: "Packaged unit",
  walk_in: "Walk-in",
  walk_in_cooler: "Walk-in cooler",
  walk_in_freezer: "Walk-in freezer",
  reach_in: "Reach-in",
  leak_and_moisture: "Leak and moisture",
};

const SNAKE = /^[a-z][a-z0-9]*(?:_[a-z0-9]+)+$/;

export function isSnakeCaseCode(text: string): boolean {
  return SNAKE.test(text);
}

export function codeWords(text: string | null | undefined): string | null {
  if (text == null) return null;
  const t = text.trim();
  if (KNOWN[t]) return KNOWN[t];
  if (!SNAKE.test(t)) return text;
  const phrase = t.replace(/_/g, " ");
  return phrase.charAt(0).toUpperCase() + phrase.slice(1);
}

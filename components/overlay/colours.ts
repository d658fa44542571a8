/**
 * Eight line colours for overlaid curves, [light theme, dark theme], chosen to stay apart for
 * common colour-vision deficiencies (an Okabe–Ito-style set); curves are also named in the
 * legend and table, never told apart by colour alone.
 */
export const SERIES_COLOURS: [string, string][] = [
  ["#0b6e69", "#72cbbf"],
  ["#c2410c", "#fb8a5c"],
  ["#2563a8", "#7fb0ef"],
  ["#a86d05", "#f7cd6b"],
  ["#7c3aed", "#c4a5fa"],
  ["#1d7f4e", "#5fd39a"],
  ["#be185d", "#f59ac4"],
  ["#14232b", "#e8f0ee"],
];

/** Line dash per curve so overlaid lines differ in more than colour. */
export const SERIES_DASHES: number[][] = [[], [6, 3], [2, 3], [10, 4], [4, 2, 1, 2], [], [6, 3], [2, 3]];

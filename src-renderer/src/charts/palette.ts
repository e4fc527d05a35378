// Chart colours: one series colour per criterion position, chosen for contrast on light and
// dark backgrounds and distinguishable with common colour-vision deficiencies.
export const SERIES_COLOURS = [
  '#3b6ea8',
  '#c2762d',
  '#4f9a6a',
  '#8a5aa8',
  '#b54a5c',
  '#5f8f9e',
  '#a08a2a',
  '#6d6d6d',
  '#2f8c8c',
] as const;

export function seriesColour(index: number): string {
  return SERIES_COLOURS[index % SERIES_COLOURS.length] ?? '#3b6ea8';
}

export const WINDOW_COLOUR = '#b54a5c';
export const SELECTED_COLOUR = '#1f5f8b';

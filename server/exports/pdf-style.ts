/** Colours of the PDF report, from the visual language (ink on paper, copper accent). */
export const INK = '#1C2430';
export const MUTED = '#5B6573';
export const RULE = '#D9D4CA';
export const COPPER = '#A4532A';

/** A4 in points, with the margins every page uses. */
export const PAGE = { width: 595.28, height: 841.89, margin: 48 } as const;
export const CONTENT_WIDTH = PAGE.width - 2 * PAGE.margin;

import config from "../../tailwind.config";

const colors = config.theme.extend.colors;

/** Colours for canvas drawing, read from the one palette in tailwind.config.ts. */
export const PALETTE = {
  positive: colors.positive.DEFAULT,
  positiveSoft: colors.positive.soft,
  negative: colors.negative.DEFAULT,
  negativeSoft: colors.negative.soft,
  ink: colors.ink.DEFAULT,
  inkFaint: colors.ink.faint,
  paper: colors.paper.DEFAULT,
  paperSunk: colors.paper.sunk,
  petrol: colors.petrol[500],
} as const;

export const signColour = (x: number) => (x < 0 ? PALETTE.negative : PALETTE.positive);

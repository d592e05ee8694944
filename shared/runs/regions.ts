/**
 * How a side or region of an answer is named, in one place for the app and the exports: the
 * number is the one the API and the CSV carry (0 and 1 for a two-way split, 0 … k−1 for k regions),
 * so a planner reading "Side 1" on screen finds 1 in the downloaded file.
 */
export type SplitKind = 'maxcut' | 'bisection' | 'kway';

/** CSV column and table heading: "side" for two-way questions, "region" for k regions. */
export const partWord = (kind: SplitKind): 'side' | 'region' => (kind === 'kway' ? 'region' : 'side');

/** "Side 0", "Side 1", "Region 2". */
export const partName = (kind: SplitKind, part: number): string => `${kind === 'kway' ? 'Region' : 'Side'} ${part}`;

// Widths of studio fabric (common practice): quilting cotton is sold 44/45 in
// wide with 40 to 42 in usable once the selvedges are off; wide backing is
// 108 in.

import { Length } from './measure';

/** Nominal width of quilting cotton. */
export const QUILTING_COTTON_WIDTH: Length = Length.inches(44);

/** Usable width assumed unless the maker measures her fabric: 40 in, the low end of 40 to 42 in. */
export const DEFAULT_USABLE_WIDTH: Length = Length.inches(40);

/** Range of usable width of quilting cotton. */
export const USABLE_WIDTH_RANGE = Object.freeze({ min: Length.inches(40), max: Length.inches(42) });

/** Wide backing fabric. */
export const WIDE_BACKING_WIDTH: Length = Length.inches(108);

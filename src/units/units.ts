// SI conversion factors for the edges: files and screens speak millimetres, gigapascals and
// grams; everything inside barwright is SI (metres, pascals, kilograms). Multiply a value in the
// edge unit by its factor to get SI; divide to go back.

/** One millimetre in metres. */
export const millimetre = 1e-3;

/** One gigapascal in pascals. */
export const gigapascal = 1e9;

/** One gram in kilograms. */
export const gram = 1e-3;

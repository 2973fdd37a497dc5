// numeric builds functions from strings that refer to a global `numeric`, which only Node sets.
// Import this module first in every browser entry (page and workers) so the library can use it.
import numeric from 'numeric';

(globalThis as { numeric?: unknown }).numeric ??= numeric;

/** True once the global is in place (imported for its side effect; exported for tests). */
export const numericReady = (globalThis as { numeric?: unknown }).numeric !== undefined;

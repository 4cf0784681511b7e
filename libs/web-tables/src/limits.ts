import { API_LIMITS } from '@seinework/contracts';

/**
 * How much one upload may carry. The byte limit is also the server's multer limit; the row and
 * compartment limits keep a hostile or mistaken file from turning into a web the engine would
 * take minutes over (the stateless API refuses the same sizes).
 */
export const MAX_UPLOAD_BYTES = 5 * 1024 * 1024;
/** Rows over all tables of one upload. */
export const MAX_UPLOAD_ROWS = 50_000;
export const MAX_COMPARTMENTS = API_LIMITS.compartments;
/** Files in one upload (one per table at most, plus room for nothing else). */
export const MAX_UPLOAD_FILES = 6;
/** What one workbook may unpack to (its XML), as its zip directory declares. */
export const MAX_UNPACKED_BYTES = 60 * 1024 * 1024;

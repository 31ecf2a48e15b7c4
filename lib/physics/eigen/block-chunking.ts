// Cache blocking of the fast block kernels (block-project, block-subtract, block-combine): rows per chunk and basis
// columns per block. Part of the summation order: changing them changes the bits of every result.

/** Rows per chunk: 36 basis columns x 2048 rows x 8 bytes stay within a typical L2 cache (common practice). */
export const CHUNK = 2048;
/**
 * Basis columns per block in the two-column kernels: 8 columns of a chunk (complex: 256 KB) stay in L2 while every
 * column pair of w passes over them; a multiple of 4 keeps the column grouping (and so the sums) of the plain loops.
 */
export const J_BLOCK = 8;

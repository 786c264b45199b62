/** Limits shared by forms, schemas and the database; change them here only. */
export const LIMITS = {
  emailLength: 254,
  passwordLength: 200,
  nameLength: 120,
  notesLength: 20_000,
  /** Notebook (sources, sessions, runs). */
  shortTextLength: 500,
  peoplePerSession: 30,
  /** Rows of one run: 6⁴ = 1296 covers the largest standard set (four photons, six letters). */
  runRows: 1296,
  /** One uploaded counts file, bytes. */
  uploadBytes: 1_000_000,
  compareRuns: 6,
  pageSizeDefault: 25,
  pageSizeMax: 100,
  searchLength: 200,
  /** Monte Carlo samples per reconstruction (physics contract §5: default 200, up to 10,000). */
  monteCarloDefault: 200,
  monteCarloMax: 10_000,
  /** Batch uploads: files per batch (a zip counts its members), runs per sweep file. */
  batchFiles: 2_000,
  sweepRuns: 2_000,
  /** One batch request in total, bytes (every file and zip together, as sent). */
  batchUploadBytes: 50_000_000,
  /** A zip may unpack to at most this many times its own size, and this many bytes in all. */
  zipExpansionRatio: 100,
  zipUnpackedBytes: 200_000_000,
  /** Personal API tokens: longest expiry, requests per token per minute. */
  apiTokenDaysMax: 730,
  apiTokenRequestsPerMinute: 600,
} as const;

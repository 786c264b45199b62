/**
 * Version of the numeric core, stored with every reconstruction. Bump the minor number when a
 * result can change in the last digits (tolerances, algorithms), the major one when conventions do.
 */
export const ENGINE_VERSION = "1.0.0";

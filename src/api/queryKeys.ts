/** Query keys of every resource, in one place so invalidation matches what was fetched. */
export const queryKeys = {
  health: ["health"] as const,
};

/** Query keys of every resource, in one place so invalidation matches what was fetched. */
export const queryKeys = {
  health: ["health"] as const,
  me: ["me"] as const,
  labs: ["labs"] as const,
  lab: (labId: string) => ["labs", labId] as const,
  members: (labId: string) => ["labs", labId, "members"] as const,
  invitations: (labId: string) => ["labs", labId, "invitations"] as const,
  invitation: (token: string) => ["invitation", token] as const,
  devOutbox: ["dev-outbox"] as const,
};

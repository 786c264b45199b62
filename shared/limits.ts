/** Limits shared by forms, schemas and the database; change them here only. */
export const LIMITS = {
  emailLength: 254,
  passwordLength: 200,
  nameLength: 120,
  notesLength: 20_000,
} as const;

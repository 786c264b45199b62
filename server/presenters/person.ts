import type { PersonRef } from "@shared/schemas/listing";
import type { User } from "../entities/User";

/** Who created something: display name only, never the e-mail address. */
export function presentPerson(user: User | null | undefined): PersonRef {
  return user ? { id: user.id, displayName: user.displayName } : null;
}
